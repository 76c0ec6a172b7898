namespace OmicsScreen.Screening.Screen;

/// <summary>
/// One feature's forest evidence over all repeats of a screen.
/// </summary>
/// <param name="SelectionFrequency">Fraction of repeats that selected the feature.</param>
/// <param name="MedianRank">Median over repeats of the combined rank (mean of corrected-importance and permutation ranks; 1 = best).</param>
/// <param name="RankLowerQuartile">25th percentile of the combined rank over repeats (Hyndman-Fan type 7).</param>
/// <param name="RankUpperQuartile">75th percentile of the combined rank over repeats.</param>
/// <param name="NullP">p-value of the mean corrected importance against the mirrored-and-decoy null (<see cref="Importance.DecoyAugmentedNull"/>).</param>
/// <param name="PValue"><paramref name="NullP"/>, or the Altmann et al. (2010) p-value when outcome permutations ran.</param>
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
    int Order);
