using OmicsScreen.Runs.Apply;

namespace OmicsScreen.Cli.Commands;

/// <summary>What `apply --json` prints for a panel locked on a measured outcome.</summary>
public sealed record ApplyMeasuredHeadline : ApplyHeadline
{
    private ApplyMeasuredHeadline(MeasuredApplied applied) : base(applied)
    {
    }

    public string OutcomeKind { get; init; } = "measured";
    public required string Outcome { get; init; }
    public required double? RSquared { get; init; }
    public required double? Rmse { get; init; }
    public required double? CalibrationSlope { get; init; }
    public required double? CalibrationIntercept { get; init; }
    public required double DiscoveryOutOfBagRSquared { get; init; }

    public static ApplyMeasuredHeadline Of(MeasuredApplied applied) => new(applied)
    {
        Outcome = applied.Model.OutcomeName,
        RSquared = applied.Performance?.RSquared,
        Rmse = applied.Performance?.RootMeanSquaredError,
        CalibrationSlope = applied.Performance?.Calibration.Slope,
        CalibrationIntercept = applied.Performance?.Calibration.Intercept,
        DiscoveryOutOfBagRSquared = applied.Model.OutOfBagRSquared,
    };
}
