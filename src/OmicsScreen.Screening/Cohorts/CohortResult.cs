namespace OmicsScreen.Screening.Cohorts;

/// <summary>Everything the cohort check found.</summary>
/// <param name="Markers">Every feature across cohorts, in the screen's order.</param>
/// <param name="ScreenedCohorts">Cohorts large enough for a screen of their own (at least <see cref="CohortMembership.MinimumSamplesPerClass"/> per class).</param>
/// <param name="CohortPredictionAccuracy">Out-of-bag accuracy of a forest predicting the cohort from all features; far above the largest cohort's share means strong batch structure.</param>
/// <param name="LargestCohortShare">Accuracy of always guessing the largest cohort.</param>
/// <param name="OutcomeCohortCramersV">Association of outcome and cohort (Cramer 1946); near 1 means they cannot be separated.</param>
/// <param name="Confounded">True when outcome and cohort are so associated (V at or above 0.5) that no method can tell their effects apart.</param>
public sealed record CohortResult(
    string CohortColumn,
    IReadOnlyList<string> Cohorts,
    IReadOnlyList<string> ScreenedCohorts,
    IReadOnlyList<CohortConcordance> Concordance,
    IReadOnlyList<MarkerHeterogeneity> Markers,
    IReadOnlyList<HeldOutCohort> HeldOut,
    double CohortPredictionAccuracy,
    double LargestCohortShare,
    double OutcomeCohortCramersV,
    double OutcomeCohortPValue,
    bool Confounded)
{
    private Dictionary<int, MarkerHeterogeneity>? _byFeature;

    /// <summary>The cohort check of one feature (every feature is checked).</summary>
    public MarkerHeterogeneity? Marker(int featureIndex) =>
        (_byFeature ??= Markers.ToDictionary(m => m.FeatureIndex)).GetValueOrDefault(featureIndex);
}
