using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Engine.Regression;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Importances of a measured (continuous) outcome: the corrected impurity importance of
/// Nembrini, König &amp; Wright (2018, Bioinformatics 34(21):3711-3718), which covers regression
/// forests, and out-of-bag permutation importance as the rise in squared error (Breiman 2001).
/// </summary>
/// <remarks>
/// Same columns, same permuted copies and decoys (<see cref="CorrectedImpurityImportance.Augment"/>)
/// and the same permutation streams (<see cref="OutOfBagTreeScorer"/>'s seeds) as for classes, so
/// the screen's error control reads these numbers exactly as it reads the class ones.
/// </remarks>
public static class RegressionImportance
{
    /// <summary>AIR_j = MDI(j) - MDI(permuted copy of j), MDI the weighted variance decrease; decoys likewise.</summary>
    public static CorrectedImportance MeasureCorrected(BinnedMatrix matrix, ReadOnlySpan<double> outcome, int[]? trainingRows,
        ReadOnlySpan<int> decoySources, ForestOptions options)
    {
        var y = outcome.ToArray();
        return CorrectedImpurityImportance.MeasureWith(matrix, decoySources, options,
            augmented => RegressionForestTrainer.Train(augmented, y, options, trainingRows).MeanImpurityDecrease());
    }

    /// <summary>
    /// Per tree, each split feature's codes are permuted among the tree's out-of-bag rows and the
    /// rise in their mean squared error recorded; a feature the tree does not split on scores 0.
    /// Returns the mean over all trees, in squared outcome units, and its standard error (SD over
    /// trees / sqrt(trees), as for classes).
    /// </summary>
    public static ErrorRiseImportance MeasurePermutation(RegressionForest forest, BinnedMatrix matrix, ReadOnlySpan<double> outcome,
        int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(forest);
        ArgumentNullException.ThrowIfNull(matrix);
        if (matrix.FeatureCount != forest.FeatureCount || matrix.SampleCount != forest.SampleCount)
            throw new ArgumentException("The matrix must be the one the forest was grown on.");
        if (outcome.Length != forest.SampleCount) throw new ArgumentException("The outcome must have one value per sample.");
        var y = outcome.ToArray();
        var perTree = new TreePermutationScores[forest.TreeCount];
        TreeWork.ForEach(forest.TreeCount, threadCount, () => new byte[forest.SampleCount],
            (codes, t) => perTree[t] = ScoreTree(forest, t, matrix, y, codes));
        var summary = TreeScoreSummary.Summarise(perTree, forest.FeatureCount);
        return new ErrorRiseImportance(summary.MeanAccuracyDrop, summary.StandardError);
    }

    private static TreePermutationScores ScoreTree(RegressionForest forest, int t, BinnedMatrix matrix, double[] y, byte[] codes)
    {
        var rows = forest.OutOfBagRows(t);
        if (rows.Length == 0) return TreePermutationScores.Empty;
        var tree = forest.Tree(t);
        double baseError = OutOfBagError(forest, t, y, rows);
        var used = tree.Topology.SplitFeatures();
        var rises = new double[used.Length];
        // Seeds as for class forests (the registry's permutation-importance streams): a function of
        // (seed, repeat, tree, feature) only.
        ulong treeSeed = RandomStreams.PermutationImportanceTree(new ForestStreams(forest.Options.Seed, forest.Options.Repeat), t);
        for (int k = 0; k < used.Length; k++)
        {
            int feature = used[k];
            PermutedCodes.Fill(matrix, feature, rows, treeSeed, codes);
            rises[k] = ErrorRise(tree, matrix, y, rows, baseError, feature, codes);
        }
        // The per-tree summary is shared with class forests, whose first score is the accuracy drop;
        // here it carries the rise in squared error (the second, the Brier rise, is unused).
        return new TreePermutationScores(used, rises, rises);
    }

    /// <summary>Tree t's squared error summed over its out-of-bag rows (<paramref name="rows"/>, the forest's own), unpermuted.</summary>
    internal static double OutOfBagError(RegressionForest forest, int t, double[] y, ReadOnlySpan<int> rows)
    {
        var baseline = forest.OutOfBagPredictions(t);
        double baseError = 0;
        for (int i = 0; i < rows.Length; i++) baseError += (y[rows[i]] - baseline[i]) * (y[rows[i]] - baseline[i]);
        return baseError;
    }

    /// <summary>
    /// Rise in the tree's mean squared error over its out-of-bag rows when row i reads
    /// <paramref name="codes"/>[i] for the feature instead of its own code; the permutation is the
    /// caller's (the importance's own, or one within covariate strata for covariate tracking).
    /// </summary>
    internal static double ErrorRise(RegressionTree tree, BinnedMatrix matrix, double[] y, ReadOnlySpan<int> rows, double baseError,
        int feature, ReadOnlySpan<byte> codes)
    {
        double error = 0;
        for (int i = 0; i < rows.Length; i++)
        {
            double residual = y[rows[i]] - tree.NodeMeans[tree.Topology.LeafOf(matrix, rows[i], feature, codes[i])];
            error += residual * residual;
        }
        return (error - baseError) / rows.Length;
    }
}

/// <summary>Out-of-bag permutation importance of a measured or time-to-event outcome, one entry per feature.</summary>
/// <param name="MeanRise">Mean over all trees of the loss from permuting the feature: the rise in OOB mean squared error (measured outcome) or the drop in OOB concordance (time to event).</param>
/// <param name="StandardError">SD over trees (n - 1 denominator) of the per-tree rise, divided by sqrt(trees).</param>
public sealed record ErrorRiseImportance(double[] MeanRise, double[] StandardError);
