namespace OmicsScreen.Screening.Screen;

/// <summary>
/// One feature's forest evidence over all repeats of a screen.
/// </summary>
/// <param name="SelectionFrequency">Fraction of repeats that selected the feature.</param>
/// <param name="MedianRank">Median over repeats of the combined rank (mean of corrected-importance and permutation ranks; 1 = best).</param>
/// <param name="RankLowerQuartile">25th percentile of the combined rank over repeats (Hyndman-Fan type 7).</param>
/// <param name="RankUpperQuartile">75th percentile of the combined rank over repeats.</param>
/// <param name="NullP">p-value of the mean corrected importance against the decoys' means (<see cref="Importance.DecoyNull"/>), or against the mirrored null when the run has no decoys.</param>
/// <param name="PValue">The forest's p-value (<see cref="ForestP"/>) combined with the rank test's (<see cref="RankTestP"/>) and the interaction scan's (<see cref="InteractionP"/>) by the Cauchy combination test (Liu &amp; Xie 2020), then calibrated against the decoys' combinations (<see cref="Importance.DecoyNull"/>).</param>
/// <param name="QValue">Benjamini-Hochberg (1995) adjusted <paramref name="PValue"/> across all features.</param>
/// <param name="Order">1-based position in the screen's final order (frequency, then median rank).</param>
public sealed record FeatureSummary(
    int FeatureIndex,
    string Feature,
    double SelectionFrequency,
    double MedianRank,
    double RankLowerQuartile,
    double RankUpperQuartile,
    double CorrectedMean,
    double CorrectedSd,
    double PermutationMean,
    double PermutationSd,
    double ImpurityMean,
    double ImpuritySd,
    double NullP,
    double OutcomePermutationP,
    double PValue,
    double QValue,
    int Order)
{
    /// <summary><see cref="NullP"/>, or the Altmann et al. (2010) p-value when outcome permutations ran.</summary>
    public double ForestP { get; init; } = double.NaN;

    /// <summary>The rank test's p-value on the same samples; NaN when the screen used the forest's evidence alone.</summary>
    public double RankTestP { get; init; } = double.NaN;

    /// <summary>
    /// The pairwise interaction scan's p-value (<see cref="Univariate.PairwiseInteractionScan"/>):
    /// the feature's largest chi-square over partners against the decoys' (<see cref="Importance.DecoyNull"/>);
    /// NaN when the scan did not run.
    /// </summary>
    public double InteractionP { get; init; } = double.NaN;

    /// <summary>The feature index of the partner that gave the largest interaction chi-square; -1 when the scan did not run.</summary>
    public int InteractionPartner { get; init; } = -1;

    /// <summary>The weighted Cauchy combination of <see cref="ForestP"/>, <see cref="RankTestP"/> and <see cref="InteractionP"/>, each capped at 0.9 (<see cref="ScreenAggregation.Combine"/>), before its calibration against the decoys.</summary>
    public double CombinedP { get; init; } = double.NaN;
}
