using System.Diagnostics;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// One forest of `grow` on a measured or time-to-event outcome, summarised: a regression forest
/// (variance-decrease splits; Breiman et al. 1984) with its out-of-bag mean squared error and R²,
/// or a random survival forest (log-rank splits; Ishwaran et al. 2008) with the out-of-bag
/// Harrell's C of its ensemble mortality; the curve as trees are added; impurity importance (mean
/// variance decrease or log-rank statistic per tree) and out-of-bag permutation importance (the
/// rise in squared error or the drop in C when a feature's codes are permuted among a tree's
/// out-of-bag samples).
/// </summary>
/// <param name="OutOfBagError">Mean squared error (measured) or 1 - C (follow-up).</param>
/// <param name="OutOfBagScore">R² (measured) or Harrell's C (follow-up).</param>
/// <param name="ScoreInterval">Harrell's C's 95% infinitesimal-jackknife interval; undefined for R².</param>
/// <param name="Curve">Out-of-bag mean squared error (measured) or C (follow-up) after each tree.</param>
/// <param name="Impurity">Mean variance decrease or log-rank statistic per tree, per feature.</param>
/// <param name="Permutation">Mean rise in out-of-bag squared error, or drop in C, per feature.</param>
internal sealed record GrowOutcomeForest(
    OutcomeKind Kind,
    double OutOfBagError,
    double OutOfBagScore,
    ConfidenceInterval ScoreInterval,
    double[] Curve,
    double[] Impurity,
    double[] ImpurityShare,
    double[] Permutation,
    double[] PermutationStandardError,
    int FeaturesPerSplit,
    TimeSpan BinningTime,
    TimeSpan TrainingTime,
    TimeSpan ImportanceTime)
{
    public static GrowOutcomeForest Grow(Panel panel, ForestOptions options)
    {
        var watch = Stopwatch.StartNew();
        var binned = new BinMapper().Bin(panel.Matrix, options.ThreadCount);
        var binning = watch.Elapsed;
        watch.Restart();
        int featuresPerSplit = options.Tree.ResolveFeaturesPerSplit(binned.FeatureCount);
        if (panel.Kind == OutcomeKind.Measured)
        {
            var values = panel.Measured!.Values.ToArray();
            var forest = RegressionForestTrainer.Train(binned, values, options);
            var outOfBag = new RegressionOutOfBag(forest, values);
            var training = watch.Elapsed;
            watch.Restart();
            var impurity = forest.MeanImpurityDecrease();
            var permutation = RegressionImportance.MeasurePermutation(forest, binned, values, options.ThreadCount);
            return new GrowOutcomeForest(panel.Kind, outOfBag.MeanSquaredError, outOfBag.RSquared, ConfidenceInterval.Undefined(0.95),
                outOfBag.ErrorCurve.ToArray(), impurity, Shares(impurity), permutation.MeanRise, permutation.StandardError, featuresPerSplit,
                binning, training, watch.Elapsed);
        }
        else
        {
            var followUp = panel.FollowUp!.FollowUp;
            var forest = SurvivalForestTrainer.Train(binned, followUp, options);
            var concordance = SurvivalImportance.OutOfBagConcordance(forest);
            var curve = OutOfBagConcordanceCurve.Of(forest);
            var training = watch.Elapsed;
            watch.Restart();
            var impurity = forest.MeanSplitStatistic();
            var permutation = SurvivalImportance.MeasurePermutation(forest, binned, options.ThreadCount);
            return new GrowOutcomeForest(panel.Kind, 1 - concordance.Concordance, concordance.Concordance, concordance.Interval,
                curve, impurity, Shares(impurity), permutation.MeanRise, permutation.StandardError, featuresPerSplit,
                binning, training, watch.Elapsed);
        }
    }

    /// <summary>Each feature's share of the summed importance (0 when the sum is not positive).</summary>
    private static double[] Shares(double[] values)
    {
        double total = 0;
        foreach (double v in values) total += v;
        var shares = new double[values.Length];
        if (total > 0)
            for (int i = 0; i < values.Length; i++) shares[i] = values[i] / total;
        return shares;
    }
}
