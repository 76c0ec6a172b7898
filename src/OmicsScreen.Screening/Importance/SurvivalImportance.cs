using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Parallelism;
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
        return Concordance(forest.FollowUp, kept, kept.Select(s => risk[s]).ToArray());
    }

    /// <summary>AIR_j = mean log-rank statistic of j minus that of its permuted copy; decoys likewise.</summary>
    public static CorrectedImportance MeasureCorrected(BinnedMatrix matrix, FollowUpTimes followUp, int[]? trainingRows,
        ReadOnlySpan<int> decoySources, ForestOptions options)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(options);
        int featureCount = matrix.FeatureCount;
        CorrectedImpurityImportance.CheckDecoySources(decoySources, featureCount);
        var augmented = CorrectedImpurityImportance.Augment(matrix, decoySources, options.Seed, options.Repeat, options.ThreadCount);
        var statistic = SurvivalForestTrainer.Train(augmented, followUp, options, trainingRows).MeanSplitStatistic();
        return CorrectedImpurityImportance.FromAugmented(statistic, featureCount, decoySources);
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
        int threads = Math.Min(WorkerThreads.Resolve(threadCount), Math.Max(1, forest.TreeCount));
        int next = -1;
        Parallel.For(0, threads, new ParallelOptions { MaxDegreeOfParallelism = threads }, _ =>
        {
            int t;
            while ((t = Interlocked.Increment(ref next)) < forest.TreeCount)
                perTree[t] = ScoreTree(forest, t, matrix);
        });
        var summary = TreeScoreSummary.Summarise(perTree, forest.FeatureCount);
        return new ErrorRiseImportance(summary.MeanAccuracyDrop, summary.StandardError);
    }

    private static TreePermutationScores ScoreTree(SurvivalForest forest, int t, BinnedMatrix matrix)
    {
        var rows = forest.OutOfBagRows(t).ToArray();
        if (rows.Length < 2) return TreePermutationScores.Empty;
        var baseline = Concordance(forest.FollowUp, rows, forest.OutOfBagMortality(t).ToArray());
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
            for (int i = 0; i < rows.Length; i++) risk[i] = tree.Mortality[tree.Topology.LeafOf(matrix, rows[i], feature, codes[i])];
            drops[k] = baseline.Concordance - Concordance(forest.FollowUp, rows, risk).Concordance;
        }
        return new TreePermutationScores(features, drops, drops);
    }

    private static ConcordanceEstimate Concordance(FollowUpTimes followUp, int[] rows, double[] risk)
    {
        var time = new double[rows.Length];
        var events = new bool[rows.Length];
        for (int i = 0; i < rows.Length; i++)
        {
            time[i] = followUp.Times[rows[i]];
            events[i] = followUp.Events[rows[i]];
        }
        return HarrellConcordance.Estimate(time, events, risk);
    }
}
