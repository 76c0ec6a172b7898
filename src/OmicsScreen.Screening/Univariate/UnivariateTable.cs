namespace OmicsScreen.Screening.Univariate;

/// <summary>The per-marker univariate statistics of a panel.</summary>
/// <param name="Contrasts">Contrast class names in row order: the positive class for a binary outcome, every class otherwise.</param>
/// <param name="AllSamples">Rows over all samples, feature-major: row f * Contrasts.Count + c.</param>
/// <param name="PerCohort">Rows within each cohort, cohort-major then as <paramref name="AllSamples"/>; empty without cohorts.</param>
public sealed record UnivariateTable(
    IReadOnlyList<string> Contrasts,
    IReadOnlyList<MarkerStatistics> AllSamples,
    IReadOnlyList<MarkerStatistics> PerCohort)
{
    /// <summary>The all-samples row of one feature and contrast.</summary>
    public MarkerStatistics Row(int feature, int contrast) => AllSamples[feature * Contrasts.Count + contrast];
}
