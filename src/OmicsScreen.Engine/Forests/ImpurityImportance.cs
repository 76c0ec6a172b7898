namespace OmicsScreen.Engine.Forests;

/// <summary>
/// Mean decrease in impurity (Breiman 2001; Breiman et al. 1984 ch. 5): for each feature the
/// weighted Gini decreases of its splits, summed per tree and averaged over trees.
/// </summary>
public sealed class ImpurityImportance
{
    private readonly double[] _meanDecrease;
    private readonly double[] _normalisedMeanDecrease;

    private ImpurityImportance(double[] meanDecrease, double[] normalisedMeanDecrease)
    {
        _meanDecrease = meanDecrease;
        _normalisedMeanDecrease = normalisedMeanDecrease;
    }

    /// <summary>Sum over a tree's splits on the feature of (W_t G_t - W_L G_L - W_R G_R)/W_root, averaged over trees.</summary>
    public ReadOnlySpan<double> MeanDecrease => _meanDecrease;

    /// <summary>
    /// Each tree's decreases scaled to sum to 1, then averaged over trees with at least one split
    /// and rescaled to sum to 1: the definition of scikit-learn's feature_importances_.
    /// </summary>
    public ReadOnlySpan<double> NormalisedMeanDecrease => _normalisedMeanDecrease;

    public static ImpurityImportance From(Forest forest)
    {
        ArgumentNullException.ThrowIfNull(forest);
        int featureCount = forest.FeatureCount;
        var mean = new double[featureCount];
        var normalised = new double[featureCount];
        var perTree = new double[featureCount];
        int splitTrees = 0;
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var tree = forest.Tree(t);
            Array.Clear(perTree);
            tree.AddImpurityDecreases(perTree);
            double treeTotal = 0;
            for (int f = 0; f < featureCount; f++)
            {
                mean[f] += perTree[f];
                treeTotal += perTree[f];
            }
            if (tree.SplitCount == 0 || treeTotal <= 0) continue;
            splitTrees++;
            for (int f = 0; f < featureCount; f++) normalised[f] += perTree[f] / treeTotal;
        }
        double normalisedTotal = 0;
        for (int f = 0; f < featureCount; f++)
        {
            mean[f] /= forest.TreeCount;
            normalisedTotal += normalised[f];
        }
        if (splitTrees > 0 && normalisedTotal > 0)
            for (int f = 0; f < featureCount; f++) normalised[f] /= normalisedTotal;
        return new ImpurityImportance(mean, normalised);
    }
}
