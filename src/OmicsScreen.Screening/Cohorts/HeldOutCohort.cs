using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Leave-one-cohort-out validation: the screen runs on every other cohort, a forest on its top
/// markers is scored on this cohort, which it never saw.
/// </summary>
/// <param name="Auc">Held-out AUC of the positive-class probability (NaN for more than two classes, or a one-class cohort).</param>
/// <param name="Error">Held-out misclassification rate at the majority vote.</param>
public sealed record HeldOutCohort(string Cohort, int SampleCount, int PanelSize, double Auc, ConfidenceInterval AucInterval, double Error);
