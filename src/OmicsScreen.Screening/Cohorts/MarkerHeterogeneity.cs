using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One marker across cohorts: its effect in each, the random-effects pooled within-cohort AUC with
/// I^2 and tau^2 (DerSimonian &amp; Laird 1986; Higgins &amp; Thompson 2002), how strongly it separates
/// the cohorts themselves, and the flag that follows.
/// </summary>
/// <param name="CohortSeparation">Largest one-cohort-against-the-rest Mann-Whitney AUC, folded to at least 0.5.</param>
/// <param name="PooledAuc">All samples together, ignoring cohort.</param>
public sealed record MarkerHeterogeneity(
    int FeatureIndex,
    string Feature,
    IReadOnlyList<CohortEffect> Effects,
    MetaAnalysisResult? WithinCohort,
    double PooledAuc,
    ConfidenceInterval PooledAucInterval,
    double CohortSeparation,
    string SeparatedCohort,
    int CohortImportanceRank,
    CohortFlag Flag)
{
    /// <summary>Benjamini-Hochberg q-value of Cochran's Q test across all features; NaN with fewer than two usable cohorts.</summary>
    public double HeterogeneityQValue { get; init; } = double.NaN;
}
