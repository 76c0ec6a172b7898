namespace OmicsScreen.Screening.Locking;

/// <summary>How a locked measured panel did on a cohort whose outcome is known.</summary>
/// <param name="RSquared">1 - SSE / SST, SST about this cohort's own mean (as scikit-learn's r2_score): 0 is no better than the cohort mean, negative worse.</param>
/// <param name="RootMeanSquaredError">sqrt(SSE / n), in the outcome's units.</param>
/// <param name="Calibration">Observed regressed on predicted (slope, intercept and their intervals).</param>
/// <param name="Groups">Samples grouped by rank of prediction (up to ten groups of at least ten), lowest first.</param>
/// <param name="Predicted">The predictions, in sample order, for the calibration plot.</param>
/// <param name="Observed">The known outcome, in sample order.</param>
public sealed record LockedMeasuredPerformance(
    int SampleCount,
    double RSquared,
    double RootMeanSquaredError,
    CalibrationLine Calibration,
    IReadOnlyList<MeasuredCalibrationBin> Groups,
    double[] Predicted,
    double[] Observed);
