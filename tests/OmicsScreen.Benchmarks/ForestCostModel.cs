namespace OmicsScreen.Benchmarks;

/// <summary>
/// Processor seconds (core-seconds) of the work a screen repeats, fitted on the scaling series:
/// growing one tree, the out-of-bag permutation importance of one tree, and binning a panel.
/// Core-seconds carry over to other core counts when the work divides evenly over the cores.
/// </summary>
public sealed record ForestCostModel(ShapeCost TrainPerTree, ShapeCost PermutationPerTree, ShapeCost Binning)
{
    public static ForestCostModel Fit(IReadOnlyList<ScalingPoint> samplesSeries, IReadOnlyList<ScalingPoint> featuresSeries) => new(
        ShapeCost.Fit(samplesSeries, featuresSeries, p => p.TrainCpuSeconds / p.TreeCount),
        ShapeCost.Fit(samplesSeries, featuresSeries, p => p.PermutationCpuSeconds / p.TreeCount),
        ShapeCost.Fit(samplesSeries, featuresSeries, p => p.BinCpuSeconds));

    /// <summary>Core-seconds to grow a forest on the given training rows and columns.</summary>
    public double Train(int trees, double rows, double columns) => trees * TrainPerTree.At(rows, columns);

    /// <summary>Core-seconds of a forest's out-of-bag permutation importance.</summary>
    public double Permutation(int trees, double rows, double columns) => trees * PermutationPerTree.At(rows, columns);
}
