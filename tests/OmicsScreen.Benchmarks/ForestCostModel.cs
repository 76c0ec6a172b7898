namespace OmicsScreen.Benchmarks;

/// <summary>
/// Processor seconds (core-seconds) of the work a screen repeats, fitted on the scaling series:
/// growing one tree, the out-of-bag permutation importance of one tree, binning a panel, and
/// building the permuted-copy columns of a corrected-importance forest. Core-seconds of the parallel
/// parts carry over to other core counts when the work divides evenly over the cores; the
/// permuted-copy columns are built on one thread, so their seconds do not shrink with more cores.
/// </summary>
public sealed record ForestCostModel(ShapeCost TrainPerTree, ShapeCost PermutationPerTree, ShapeCost Binning,
    ShapeCost PermutedCopies)
{
    /// <param name="oneOff">The per-process part taken out of every point's training and permutation time before fitting.</param>
    public static ForestCostModel Fit(IReadOnlyList<ScalingPoint> samplesSeries, IReadOnlyList<ScalingPoint> featuresSeries,
        OneOffCost oneOff) => new(
        ShapeCost.Fit(samplesSeries, featuresSeries, oneOff.TrainPerTree),
        ShapeCost.FitFlatOverFeatures(samplesSeries, featuresSeries, oneOff.PermutationPerTree,
            p => p.PermutationCpuSeconds / p.TreeCount),
        ShapeCost.Fit(samplesSeries, featuresSeries, p => p.BinCpuSeconds),
        ShapeCost.Fit(samplesSeries, featuresSeries, p => p.CopyCpuSeconds));

    /// <summary>Core-seconds to grow a forest on the given training rows and columns.</summary>
    public double Train(int trees, double rows, double columns) => trees * TrainPerTree.At(rows, columns);

    /// <summary>Core-seconds of a forest's out-of-bag permutation importance.</summary>
    public double Permutation(int trees, double rows, double columns) => trees * PermutationPerTree.At(rows, columns);
}
