namespace OmicsScreen.Benchmarks;

/// <summary>Every run of one case, kept whole so that a suite report can take medians of any figure.</summary>
public sealed record BenchmarkMeasurement(string Suite, string Name, IReadOnlyList<BenchmarkRun> Runs)
{
    /// <summary>The median over runs of a quantity read from each run (upper median for an even count).</summary>
    public double Median(Func<BenchmarkRun, double> quantity)
    {
        var values = new double[Runs.Count];
        for (int i = 0; i < values.Length; i++) values[i] = quantity(Runs[i]);
        Array.Sort(values);
        return values[values.Length / 2];
    }

    public double MedianFigure(string key) => Median(run => run.Figure(key));
}
