using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The evidence of direct tests on the values, beside the forest's, for a screen's features and
/// its decoys on the samples the screen uses: the rank test's p-value, and the pairwise
/// interaction scan's (<see cref="PairwiseInteractionScan"/>) calibrated against the decoys'
/// scans. Arrays are empty when a test did not run.
/// </summary>
internal sealed record DirectTestEvidence(
    double[] FeatureRankP,
    double[] DecoyRankP,
    double[] FeatureInteractionP,
    double[] DecoyInteractionP,
    int[] InteractionPartners)
{
    /// <summary>The outcome kind's weights of the forest and these tests in the combination (<see cref="ScreenOutcome.CombinationWeights"/>).</summary>
    public CombinationWeights Weights { get; init; } = CombinationWeights.Even;

    /// <summary>The rank test of the outcome's kind (<see cref="ScreenOutcome.RankTestPValues"/>) and, where the settings run it, the interaction scan.</summary>
    public static DirectTestEvidence Compute(ScreenContext context, int[] rows, DecoyPlan decoys)
    {
        var (panel, threadCount) = (context.Panel, context.ThreadCount);
        var weights = context.ScreenOutcome.CombinationWeights;
        var featureRankP = context.ScreenOutcome.RankTestPValues(panel.Matrix, rows, threadCount);
        if (decoys.DecoyCount == 0) return new DirectTestEvidence(featureRankP, [], [], [], []) { Weights = weights };
        var decoyValues = decoys.Values(panel.Matrix);
        var decoyRankP = context.ScreenOutcome.RankTestPValues(decoyValues, rows, threadCount);
        if (!context.Settings.InteractionScan) return new DirectTestEvidence(featureRankP, decoyRankP, [], [], []) { Weights = weights };

        // A decoy is scanned against the real features, as a real feature is against the others,
        // so its largest chi-square has the law of a null feature's (its own source is one more
        // unrelated partner, being permuted).
        var (statistics, partners) = PairwiseInteractionScan.Scan(panel.Matrix, decoyValues, panel.Outcome, rows, threadCount);
        int featureCount = panel.FeatureCount;
        var decoyStatistics = statistics.AsSpan(featureCount);
        return new DirectTestEvidence(featureRankP, decoyRankP,
            DecoyNull.PValues(decoyStatistics, statistics.AsSpan(0, featureCount)),
            DecoyNull.DecoyPValues(decoyStatistics),
            partners[..featureCount]) { Weights = weights };
    }
}
