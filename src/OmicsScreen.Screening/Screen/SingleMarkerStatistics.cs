using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The single-marker statistics of a screen in its outcome kind's form: the class rank tests, or
/// Spearman rows against a measured outcome, or Harrell's C and Cox rows against follow-up (the
/// other two empty), with each feature's rank by its p-value (1 = smallest).
/// </summary>
/// <param name="PositiveContrast">The class table's contrast of the positive class; -1 for other kinds.</param>
internal sealed record SingleMarkerStatistics(
    UnivariateTable Classes,
    MeasuredOutcomeMarker[] Measured,
    FollowUpMarker[] FollowUp,
    int[] Ranks,
    int PositiveContrast)
{
    /// <summary>A shortlisted marker with the statistics of its kind.</summary>
    public ShortlistEntry Entry(int rank, FeatureSummary forest, int redundancyGroup, double groupImportance)
    {
        int f = forest.FeatureIndex;
        return new ShortlistEntry(rank, forest, redundancyGroup, groupImportance,
            PositiveContrast >= 0 ? Classes.Row(f, PositiveContrast) : null, Ranks[f])
        {
            Measured = Measured.Length > 0 ? Measured[f] : null,
            FollowUp = FollowUp.Length > 0 ? FollowUp[f] : null,
        };
    }

}
