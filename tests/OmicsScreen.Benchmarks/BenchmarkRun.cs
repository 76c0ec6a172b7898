using System.Globalization;

namespace OmicsScreen.Benchmarks;

/// <summary>One run of a case in its own child process: wall time of the case, peak resident memory, and the case's figures.</summary>
public sealed record BenchmarkRun(double Seconds, long PeakBytes, IReadOnlyList<string> Figures)
{
    /// <summary>The value of a "key=value" figure the case printed, or NaN when it printed none.</summary>
    public double Figure(string key)
    {
        string prefix = key + "=";
        foreach (var figure in Figures)
            if (figure.StartsWith(prefix, StringComparison.Ordinal)
                && double.TryParse(figure.AsSpan(prefix.Length), NumberStyles.Float, CultureInfo.InvariantCulture, out double value))
                return value;
        return double.NaN;
    }
}
