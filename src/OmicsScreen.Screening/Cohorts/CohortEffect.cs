using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>A marker's effect within one cohort, in its outcome kind's measure (<see cref="CohortEffectMeasure"/>).</summary>
/// <param name="Log2MedianRatio">Positive class against the rest (classes); NaN for other kinds.</param>
/// <param name="Effect">AUC, Spearman's rho or hazard ratio per SD; NaN when the cohort gives none.</param>
/// <param name="StandardError">On the scale the effects are pooled on: the AUC's (DeLong), Fisher z's (Bonett &amp; Wright 2000) or the log hazard ratio's (Cox model).</param>
/// <param name="Interval">The effect's 95% interval on its own scale.</param>
public sealed record CohortEffect(string Cohort, int SampleCount, double Log2MedianRatio, double Effect, double StandardError, ConfidenceInterval Interval);
