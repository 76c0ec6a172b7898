using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Locking;

/// <summary>How a locked panel did on a cohort whose outcome is known.</summary>
/// <param name="ClassNames">Classes, in the locked panel's class-code order.</param>
/// <param name="Auc">AUC of the positive-class probability; null unless binary or when a class is absent.</param>
/// <param name="AucInterval">DeLong 95% confidence interval of the AUC, clipped to [0, 1].</param>
/// <param name="Error">Fraction of samples called wrongly (at the locked threshold when binary).</param>
/// <param name="Confusion">Counts by true class (row) and called class (column), in class-code order.</param>
/// <param name="Calibration">Groups of predicted positive-class probability, lowest first.</param>
public sealed record LockedPanelPerformance(
    IReadOnlyList<string> ClassNames,
    int PositiveClass,
    int SampleCount,
    double? Threshold,
    double? Auc,
    ConfidenceInterval? AucInterval,
    double Error,
    int[][] Confusion,
    IReadOnlyList<CalibrationBin> Calibration);
