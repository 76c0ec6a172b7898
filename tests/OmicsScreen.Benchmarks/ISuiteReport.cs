namespace OmicsScreen.Benchmarks;

/// <summary>A summary printed after every case of one suite has run, from all their runs.</summary>
public interface ISuiteReport
{
    string Suite { get; }

    void Write(IReadOnlyList<BenchmarkMeasurement> measurements, TextWriter output);
}
