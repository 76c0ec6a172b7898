namespace OmicsScreen.Screening.Cohorts;

/// <summary>Everything the cohort check found.</summary>
/// <param name="Markers">Every feature across cohorts, in the screen's order.</param>
/// <param name="ScreenedCohorts">Cohorts large enough for a screen of their own (<see cref="CohortMembership"/>: at least 5 samples per class, 20 samples with a measured outcome, or 10 events).</param>
/// <param name="CohortPredictionAccuracy">Out-of-bag accuracy of a forest predicting the cohort from all features; far above the largest cohort's share means strong batch structure.</param>
/// <param name="LargestCohortShare">Accuracy of always guessing the largest cohort.</param>
/// <param name="OutcomeCohortAssociation">
/// How much the outcome depends on the cohort, 0 to 1: Cramér's V of the class x cohort table
/// (Cramér 1946), or the correlation ratio eta of the outcome's ranks or of the follow-up's
/// martingale residuals on cohort (<see cref="Cohorts.OutcomeCohortAssociation"/>); near 1 means they cannot be separated.
/// </param>
/// <param name="OutcomeCohortPValue">Chi-square test of independence, Kruskal-Wallis test, or k-sample log-rank test.</param>
/// <param name="Confounded">True when outcome and cohort are so associated (at or above 0.5) that no method can tell their effects apart.</param>
public sealed record CohortResult(
    string CohortColumn,
    IReadOnlyList<string> Cohorts,
    IReadOnlyList<string> ScreenedCohorts,
    IReadOnlyList<CohortConcordance> Concordance,
    IReadOnlyList<MarkerHeterogeneity> Markers,
    IReadOnlyList<HeldOutCohort> HeldOut,
    double CohortPredictionAccuracy,
    double LargestCohortShare,
    double OutcomeCohortAssociation,
    double OutcomeCohortPValue,
    bool Confounded)
{
    private Dictionary<int, MarkerHeterogeneity>? _byFeature;

    /// <summary>What the markers' effects are measured in: AUC (classes), Spearman's rho (measured) or hazard ratio per SD (follow-up).</summary>
    public CohortEffectMeasure Measure { get; init; } = CohortEffectMeasure.Auc;

    /// <summary>The cohort check of one feature (every feature is checked).</summary>
    public MarkerHeterogeneity? Marker(int featureIndex) =>
        (_byFeature ??= Markers.ToDictionary(m => m.FeatureIndex)).GetValueOrDefault(featureIndex);
}
