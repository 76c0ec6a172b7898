using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Univariate;

/// <summary>Settings of the per-marker univariate table.</summary>
/// <param name="PerCohort">Also compute rows within each cohort when the panel names cohorts.</param>
/// <param name="ConfidenceLevel">Coverage of the AUC intervals, 0.95 by default.</param>
/// <param name="IntervalScale">Scale of the AUC interval; probability scale clipped to [0, 1] by default.</param>
/// <param name="MaxDegreeOfParallelism">Threads over features; -1 uses every core. Results do not depend on it.</param>
public sealed record UnivariateOptions(
    bool PerCohort = true,
    double ConfidenceLevel = 0.95,
    AucIntervalScale IntervalScale = AucIntervalScale.Probability,
    int MaxDegreeOfParallelism = -1)
{
    public static UnivariateOptions Default { get; } = new();
}
