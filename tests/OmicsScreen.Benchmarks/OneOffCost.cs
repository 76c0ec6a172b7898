namespace OmicsScreen.Benchmarks;

/// <summary>
/// The part of a point's training and permutation time that does not grow with trees: the
/// intercept of a straight line through the trees series (MathNet.Numerics Fit.Line), kept
/// between 0 and half the smallest measured time. Each point runs in a fresh process, so this
/// is mostly the runtime finishing its optimised code; a screen pays it once, not per forest
/// (the check screen's 291 forests cost less in all than 291 such parts would).
/// </summary>
public sealed record OneOffCost(double TrainCpuSeconds, double PermutationCpuSeconds)
{
    public static OneOffCost None { get; } = new(0, 0);

    public static OneOffCost Fit(IReadOnlyList<ScalingPoint> treesSeries)
    {
        if (treesSeries.Count < 2) return None;
        return new OneOffCost(Intercept(treesSeries, p => p.TrainCpuSeconds), Intercept(treesSeries, p => p.PermutationCpuSeconds));
    }

    /// <summary>Training core-seconds per tree of a point with the one-off part taken out.</summary>
    public double TrainPerTree(ScalingPoint point) => (point.TrainCpuSeconds - TrainCpuSeconds) / point.TreeCount;

    public double PermutationPerTree(ScalingPoint point) => (point.PermutationCpuSeconds - PermutationCpuSeconds) / point.TreeCount;

    private static double Intercept(IReadOnlyList<ScalingPoint> series, Func<ScalingPoint, double> seconds)
    {
        var trees = new double[series.Count];
        var values = new double[series.Count];
        double smallest = double.PositiveInfinity;
        for (int i = 0; i < series.Count; i++)
        {
            trees[i] = series[i].TreeCount;
            values[i] = seconds(series[i]);
            smallest = Math.Min(smallest, values[i]);
        }
        var (intercept, _) = MathNet.Numerics.Fit.Line(trees, values);
        return Math.Clamp(intercept, 0, smallest / 2);
    }
}
