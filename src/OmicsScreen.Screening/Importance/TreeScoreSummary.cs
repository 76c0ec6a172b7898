namespace OmicsScreen.Screening.Importance;

/// <summary>Means and standard errors over all trees of sparse per-tree scores.</summary>
/// <remarks>
/// A score of exactly 0 is skipped whether it is listed or not, so a tree listing every feature
/// and a tree listing only its split features give bit-identical sums: x + 0 is x. The sum of
/// squared deviations adds each skipped tree's (0 - mean)^2 as one product, zeros * mean^2,
/// after the listed ones (two-pass variance, no cancellation of large sums).
/// </remarks>
internal static class TreeScoreSummary
{
    public static PermutationImportance Summarise(TreePermutationScores[] trees, int featureCount)
    {
        int treeCount = trees.Length;
        var accuracySum = new double[featureCount];
        var brierSum = new double[featureCount];
        var nonZeroTrees = new int[featureCount];
        foreach (var tree in trees)
        {
            var features = tree.Features;
            for (int i = 0; i < features.Length; i++)
            {
                double drop = tree.AccuracyDrops[i];
                if (drop != 0)
                {
                    accuracySum[features[i]] += drop;
                    nonZeroTrees[features[i]]++;
                }
                double increase = tree.BrierIncreases[i];
                if (increase != 0) brierSum[features[i]] += increase;
            }
        }
        var mean = new double[featureCount];
        var brier = new double[featureCount];
        for (int f = 0; f < featureCount; f++)
        {
            mean[f] = accuracySum[f] / treeCount;
            brier[f] = brierSum[f] / treeCount;
        }
        var squaredDeviations = new double[featureCount];
        foreach (var tree in trees)
        {
            var features = tree.Features;
            for (int i = 0; i < features.Length; i++)
            {
                double drop = tree.AccuracyDrops[i];
                if (drop == 0) continue;
                double deviation = drop - mean[features[i]];
                squaredDeviations[features[i]] += deviation * deviation;
            }
        }
        var standardError = new double[featureCount];
        for (int f = 0; f < featureCount; f++)
        {
            if (treeCount < 2)
            {
                standardError[f] = double.NaN;
                continue;
            }
            double total = squaredDeviations[f] + (treeCount - nonZeroTrees[f]) * mean[f] * mean[f];
            standardError[f] = Math.Sqrt(total / (treeCount - 1)) / Math.Sqrt(treeCount);
        }
        return new PermutationImportance(mean, standardError, brier);
    }
}
