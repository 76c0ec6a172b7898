using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Cli.Commands;

/// <summary>What `apply --json` prints for a panel locked on a measured outcome.</summary>
public sealed record ApplyMeasuredHeadline
{
    public string OutcomeKind { get; init; } = "measured";
    public required string ResultsFolder { get; init; }
    public required string Report { get; init; }
    public required int Samples { get; init; }
    public required string Outcome { get; init; }
    public required IReadOnlyList<string> Markers { get; init; }
    public required IReadOnlyDictionary<string, string> MarkerDisplayNames { get; init; }
    public required double? RSquared { get; init; }
    public required double? Rmse { get; init; }
    public required double? CalibrationSlope { get; init; }
    public required double? CalibrationIntercept { get; init; }
    public required double DiscoveryOutOfBagRSquared { get; init; }
    public required IReadOnlyList<string> Warnings { get; init; }

    public static ApplyMeasuredHeadline Of(LockedMeasuredPanel model, LockedMeasuredScores scores, LockedMeasuredPerformance? performance, string folder,
        IReadOnlyList<string> discoveryOverlap, IReadOnlyDictionary<string, string> displayNames) => new()
    {
        ResultsFolder = folder,
        Report = Path.Combine(folder, ApplyResultFiles.Report),
        Samples = scores.SampleCount,
        Outcome = model.OutcomeName,
        Markers = model.MarkerNames,
        MarkerDisplayNames = displayNames,
        RSquared = performance?.RSquared,
        Rmse = performance?.RootMeanSquaredError,
        CalibrationSlope = performance?.Calibration.Slope,
        CalibrationIntercept = performance?.Calibration.Intercept,
        DiscoveryOutOfBagRSquared = model.OutOfBagRSquared,
        Warnings = [.. discoveryOverlap, .. scores.Warnings.Select(w => w.Message)],
    };
}
