using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One marker across cohorts: its effect in each, the random-effects pooled within-cohort effect
/// with I^2 and tau^2 (DerSimonian &amp; Laird 1986; Higgins &amp; Thompson 2002), how strongly it
/// separates the cohorts themselves, and the flag that follows.
/// </summary>
/// <param name="WithinCohort">The pooling on its own scale (AUC, Fisher z or log hazard ratio); null with fewer than two usable cohorts.</param>
/// <param name="AllSamplesEffect">All samples together, ignoring cohort, in the same measure.</param>
/// <param name="CohortSeparation">Largest one-cohort-against-the-rest Mann-Whitney AUC, folded to at least 0.5.</param>
public sealed record MarkerHeterogeneity(
    int FeatureIndex,
    string Feature,
    IReadOnlyList<CohortEffect> Effects,
    MetaAnalysisResult? WithinCohort,
    double AllSamplesEffect,
    ConfidenceInterval AllSamplesInterval,
    double CohortSeparation,
    string SeparatedCohort,
    int CohortImportanceRank,
    CohortFlag Flag)
{
    /// <summary>What the effects are measured in.</summary>
    public CohortEffectMeasure Measure { get; init; } = CohortEffectMeasure.Auc;

    /// <summary>Benjamini-Hochberg q-value of Cochran's Q test across all features; NaN with fewer than two usable cohorts.</summary>
    public double HeterogeneityQValue { get; init; } = double.NaN;

    /// <summary>The random-effects pooled within-cohort effect on the effect's own scale; NaN without a pooling.</summary>
    public double WithinCohortEffect => WithinCohort is { } within ? Measure.FromPooledScale(within.RandomEstimate) : double.NaN;

    /// <summary>Its interval on the effect's own scale.</summary>
    public ConfidenceInterval WithinCohortInterval => WithinCohort is { } within
        ? new ConfidenceInterval(Measure.FromPooledScale(within.RandomInterval.Lower), Measure.FromPooledScale(within.RandomInterval.Upper), within.RandomInterval.Level)
        : ConfidenceInterval.Undefined(0.95);
}
