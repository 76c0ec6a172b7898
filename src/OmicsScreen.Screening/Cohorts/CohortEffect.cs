using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>A marker's effect within one cohort: positive class against the rest.</summary>
public sealed record CohortEffect(string Cohort, int SampleCount, double Log2MedianRatio, double Auc, double AucStandardError, ConfidenceInterval AucInterval);
