using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>
/// evaluation.json of `apply` for a panel locked on a measured outcome, with the outcome known:
/// R², RMSE, the calibration line (observed regressed on predicted) with its intervals, groups of
/// predictions, and the warnings that qualify them.
/// </summary>
public sealed record ApplyMeasuredEvaluation
{
    public string Tool { get; init; } = ManifestTool.Name;
    public string OutcomeKind { get; init; } = "measured";
    public required int Samples { get; init; }
    public required string Outcome { get; init; }
    public required double RSquared { get; init; }
    public required double Rmse { get; init; }
    public required EvaluationEstimate CalibrationSlope { get; init; }
    public required EvaluationEstimate CalibrationIntercept { get; init; }
    public required double ResidualStandardError { get; init; }
    public required IReadOnlyList<MeasuredCalibrationBin> CalibrationGroups { get; init; }
    public required double DiscoveryOutOfBagRSquared { get; init; }
    public required double DiscoveryOutOfBagRmse { get; init; }
    public required IReadOnlyList<EvaluationScaleWarning> ScaleWarnings { get; init; }
    public required IReadOnlyList<string> DiscoveryOverlapWarnings { get; init; }

    public const string CalibrationMethod = "ordinary least squares of observed on predicted, Student t interval with n - 2 degrees of freedom";

    public static ApplyMeasuredEvaluation Of(LockedMeasuredPanel model, LockedMeasuredScores scores, LockedMeasuredPerformance performance,
        IReadOnlyList<string> overlap) => new()
    {
        Samples = performance.SampleCount,
        Outcome = model.OutcomeName,
        RSquared = performance.RSquared,
        Rmse = performance.RootMeanSquaredError,
        CalibrationSlope = Estimate(performance.Calibration.Slope, performance.Calibration.SlopeInterval),
        CalibrationIntercept = Estimate(performance.Calibration.Intercept, performance.Calibration.InterceptInterval),
        ResidualStandardError = performance.Calibration.ResidualStandardError,
        CalibrationGroups = performance.Groups,
        DiscoveryOutOfBagRSquared = model.OutOfBagRSquared,
        DiscoveryOutOfBagRmse = model.OutOfBagRootMeanSquaredError,
        ScaleWarnings = scores.Warnings.Select(w => new EvaluationScaleWarning(w.Marker, w.Unmeasured, w.Message)).ToArray(),
        DiscoveryOverlapWarnings = overlap,
    };

    private static EvaluationEstimate Estimate(double value, ConfidenceInterval interval) =>
        new(value, interval.Lower, interval.Upper, interval.Level, CalibrationMethod);
}
