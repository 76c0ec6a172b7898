using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>
/// evaluation.json of `apply` with a known outcome: how the locked panel did on the cohort (AUC
/// with its DeLong interval, error and confusion at the locked call, calibration) and the
/// warnings that qualify it.
/// </summary>
public sealed record ApplyEvaluation
{
    public string Tool { get; init; } = ManifestTool.Name;
    public required int Samples { get; init; }
    public required IReadOnlyList<string> Classes { get; init; }
    public required string PositiveClass { get; init; }
    public double? Threshold { get; init; }
    public double? Auc { get; init; }
    public EvaluationAucInterval? AucInterval { get; init; }
    public required double Error { get; init; }
    public required IReadOnlyList<EvaluationConfusionRow> Confusion { get; init; }
    public required IReadOnlyList<CalibrationBin> Calibration { get; init; }
    public double? DiscoveryOutOfBagAuc { get; init; }
    public required IReadOnlyList<EvaluationScaleWarning> ScaleWarnings { get; init; }
    public required IReadOnlyList<string> DiscoveryOverlapWarnings { get; init; }

    public static ApplyEvaluation Of(LockedPanel model, LockedPanelScores scores, LockedPanelPerformance performance, IReadOnlyList<string> overlap) => new()
    {
        Samples = performance.SampleCount,
        Classes = performance.ClassNames,
        PositiveClass = performance.ClassNames[performance.PositiveClass],
        Threshold = performance.Threshold,
        Auc = performance.Auc,
        AucInterval = performance.AucInterval is { } interval
            ? new EvaluationAucInterval("DeLong 1988, normal approximation", interval.Level, interval.Lower, interval.Upper)
            : null,
        Error = performance.Error,
        Confusion = performance.ClassNames.Select((name, c) => new EvaluationConfusionRow(name,
            performance.ClassNames.Select((calledName, k) => new EvaluationCall(calledName, performance.Confusion[c][k])).ToArray())).ToArray(),
        Calibration = performance.Calibration,
        DiscoveryOutOfBagAuc = model.OutOfBagAuc,
        ScaleWarnings = scores.Warnings.Select(w => new EvaluationScaleWarning(w.Marker, w.Unmeasured, w.Message)).ToArray(),
        DiscoveryOverlapWarnings = overlap,
    };
}
