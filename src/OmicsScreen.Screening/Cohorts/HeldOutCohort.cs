using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Leave-one-cohort-out validation: the screen runs on every other cohort, a forest on its top
/// markers is scored on this cohort, which it never saw.
/// </summary>
/// <param name="Score">
/// Held-out AUC of the positive-class probability (classes; NaN for more than two classes or a
/// one-class cohort), R² (measured; NaN when the cohort's outcome does not vary) or Harrell's C of
/// the forest's mortality (follow-up).
/// </param>
/// <param name="ScoreInterval">DeLong's 95% interval of the AUC, or Harrell's C's; undefined for R².</param>
/// <param name="Error">Misclassification rate at the majority vote, mean squared error, or 1 - C.</param>
public sealed record HeldOutCohort(string Cohort, int SampleCount, int PanelSize, double Score, ConfidenceInterval ScoreInterval, double Error);
