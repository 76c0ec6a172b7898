using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Importances and out-of-bag accuracy of a time-to-event outcome: Harrell's C of the forest's
/// out-of-bag mortality (Ishwaran et al. 2008 rank samples by it), corrected impurity importance
/// from the log-rank split statistics with permuted copies (Nembrini, König &amp; Wright 2018, who
/// cover survival forests), and out-of-bag permutation importance as the drop in concordance.
/// </summary>
public static class SurvivalImportance
{
    /// <summary>Harrell's C of each sample's out-of-bag mortality, over the samples some tree left out.</summary>
    public static ConcordanceEstimate OutOfBagConcordance(SurvivalForest forest)
    {
        ArgumentNullException.ThrowIfNull(forest);
        var risk = forest.OutOfBagRisk();
        var kept = Enumerable.Range(0, risk.Length).Where(s => !double.IsNaN(risk[s])).ToArray();
        var (time, events) = FollowUpOf(forest.FollowUp, kept);
        return HarrellConcordance.Estimate(time, events, kept.Select(s => risk[s]).ToArray());
    }

    /// <summary>AIR_j = mean log-rank statistic of j minus that of its permuted copy; decoys likewise.</summary>
    public static CorrectedImportance MeasureCorrected(BinnedMatrix matrix, FollowUpTimes followUp, int[]? trainingRows,
        ReadOnlySpan<int> decoySources, ForestOptions options)
    {
        return CorrectedImpurityImportance.MeasureWith(matrix, decoySources, options,
            augmented => SurvivalForestTrainer.Train(augmented, followUp, options, trainingRows).MeanSplitStatistic());
    }

    /// <summary>
    /// Per tree, each split feature's codes are permuted among the tree's out-of-bag rows and the
    /// drop in the tree's out-of-bag C recorded (a feature the tree does not split on scores 0);
    /// mean over trees and its standard error, as for classes. Permutations come from the same
    /// (seed, repeat, tree, feature) streams as the class forests'.
    /// </summary>
    public static ErrorRiseImportance MeasurePermutation(SurvivalForest forest, BinnedMatrix matrix, int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(forest);
        ArgumentNullException.ThrowIfNull(matrix);
        if (matrix.FeatureCount != forest.FeatureCount || matrix.SampleCount != forest.SampleCount)
            throw new ArgumentException("The matrix must be the one the forest was grown on.");
        var perTree = new TreePermutationScores[forest.TreeCount];
        TreeWork.ForEach(forest.TreeCount, threadCount, () => 0, (_, t) => perTree[t] = ScoreTree(forest, t, matrix));
        var summary = TreeScoreSummary.Summarise(perTree, forest.FeatureCount);
        return new ErrorRiseImportance(summary.MeanAccuracyDrop, summary.StandardError);
    }

    private static TreePermutationScores ScoreTree(SurvivalForest forest, int t, BinnedMatrix matrix)
    {
        var rows = forest.OutOfBagRows(t).ToArray();
        if (rows.Length < 2) return TreePermutationScores.Empty;
        // The rows' follow-up is gathered once; every permuted feature is scored against it.
        var (time, events) = FollowUpOf(forest.FollowUp, rows);
        var baseline = HarrellConcordance.Estimate(time, events, forest.OutOfBagMortality(t));
        if (baseline.ComparablePairs == 0) return TreePermutationScores.Empty;
        var tree = forest.Tree(t);
        var features = tree.Topology.SplitFeatures();
        var drops = new double[features.Length];
        var codes = new byte[rows.Length];
        var risk = new double[rows.Length];
        ulong treeSeed = RandomStreams.PermutationImportanceTree(new ForestStreams(forest.Options.Seed, forest.Options.Repeat), t);
        for (int k = 0; k < features.Length; k++)
        {
            int feature = features[k];
            PermutedCodes.Fill(matrix, feature, rows, treeSeed, codes);
            drops[k] = ConcordanceDrop(tree, matrix, rows, time, events, baseline.Concordance, feature, codes, risk);
        }
        return new TreePermutationScores(features, drops, drops);
    }

    /// <summary>
    /// Drop in the tree's out-of-bag Harrell's C when row i reads <paramref name="codes"/>[i] for
    /// the feature instead of its own code (<paramref name="time"/> and <paramref name="events"/>
    /// are the rows' follow-up, <paramref name="risk"/> a buffer of one value per row); the
    /// permutation is the caller's (the importance's own, or one within covariate strata for
    /// covariate tracking).
    /// </summary>
    internal static double ConcordanceDrop(SurvivalTree tree, BinnedMatrix matrix, ReadOnlySpan<int> rows, double[] time, bool[] events,
        double baseline, int feature, ReadOnlySpan<byte> codes, Span<double> risk)
    {
        for (int i = 0; i < rows.Length; i++) risk[i] = tree.Mortality[tree.Topology.LeafOf(matrix, rows[i], feature, codes[i])];
        return baseline - HarrellConcordance.Estimate(time, events, risk).Concordance;
    }

    internal static (double[] Time, bool[] Events) FollowUpOf(FollowUpTimes followUp, int[] rows)
    {
        var time = new double[rows.Length];
        var events = new bool[rows.Length];
        for (int i = 0; i < rows.Length; i++)
        {
            time[i] = followUp.Times[rows[i]];
            events[i] = followUp.Events[rows[i]];
        }
        return (time, events);
    }
}
