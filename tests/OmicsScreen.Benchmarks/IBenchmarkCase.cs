namespace OmicsScreen.Benchmarks;

/// <summary>One measured workload. <see cref="Prepare"/> is not timed; <see cref="Run"/> is.</summary>
public interface IBenchmarkCase
{
    /// <summary>Short name used on the command line, e.g. "load-csv-wide".</summary>
    string Name { get; }

    /// <summary>Builds inputs (files, panels) outside the timed region; may cache them on disk.</summary>
    void Prepare(string workDirectory);

    /// <summary>The timed work. Returns extra figures to print (e.g. "oob_error=0.071").</summary>
    IReadOnlyList<string> Run(string workDirectory);
}
