using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>One marker of the shortlist, with everything a lab needs to judge it.</summary>
/// <param name="Rank">1-based position in the shortlist.</param>
/// <param name="RedundancyGroup">Markers sharing a group stand in for one another (Spearman |rho| at the threshold).</param>
/// <param name="GroupPermutationImportance">Out-of-bag accuracy drop when the whole group is permuted together, in the forest on all samples.</param>
/// <param name="Univariate">The marker's rank-test statistics (positive class against the rest); null for other outcome kinds (<see cref="Measured"/>, <see cref="FollowUp"/>).</param>
/// <param name="UnivariateRank">Rank of the marker by rank-test p-value among all features (1 = smallest p).</param>
public sealed record ShortlistEntry(
    int Rank,
    FeatureSummary Forest,
    int RedundancyGroup,
    double GroupPermutationImportance,
    MarkerStatistics? Univariate,
    int UnivariateRank)
{
    /// <summary>Spearman's rho, interval, p, q and direction against a measured outcome; null for other kinds.</summary>
    public MeasuredOutcomeMarker? Measured { get; init; }

    /// <summary>Harrell's C, the Cox hazard ratio per SD, p, q and direction against follow-up; null for other kinds.</summary>
    public FollowUpMarker? FollowUp { get; init; }
}
