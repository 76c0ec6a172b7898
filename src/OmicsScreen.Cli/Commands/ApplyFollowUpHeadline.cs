using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Cli.Commands;

/// <summary>What `apply --json` prints for a panel locked on a time to an event.</summary>
public sealed record ApplyFollowUpHeadline
{
    public string OutcomeKind { get; init; } = "time_to_event";
    public required string ResultsFolder { get; init; }
    public required string Report { get; init; }
    public required int Samples { get; init; }
    public required IReadOnlyList<string> Markers { get; init; }
    public required IReadOnlyDictionary<string, string> MarkerDisplayNames { get; init; }
    public required int HighRisk { get; init; }
    public required int LowRisk { get; init; }
    public required double RiskGroupCut { get; init; }
    public required int? Events { get; init; }
    public required double? Concordance { get; init; }
    public required double? ConcordanceLow95 { get; init; }
    public required double? ConcordanceHigh95 { get; init; }
    public required double? Horizon { get; init; }
    public required double? TimeDependentAuc { get; init; }
    public required double? LogRankP { get; init; }
    public required double DiscoveryOutOfBagConcordance { get; init; }
    public required IReadOnlyList<string> Warnings { get; init; }

    public static ApplyFollowUpHeadline Of(LockedFollowUpPanel model, LockedFollowUpScores scores, LockedFollowUpPerformance? performance, string folder,
        IReadOnlyList<string> discoveryOverlap, IReadOnlyDictionary<string, string> displayNames) => new()
    {
        ResultsFolder = folder,
        Report = Path.Combine(folder, ApplyResultFiles.Report),
        Samples = scores.SampleCount,
        Markers = model.MarkerNames,
        MarkerDisplayNames = displayNames,
        HighRisk = scores.HighRiskCount,
        LowRisk = scores.SampleCount - scores.HighRiskCount,
        RiskGroupCut = model.RiskGroupCut,
        Events = performance?.EventCount,
        Concordance = performance?.Concordance.Concordance,
        ConcordanceLow95 = performance?.Concordance.Interval.Lower,
        ConcordanceHigh95 = performance?.Concordance.Interval.Upper,
        Horizon = performance?.TimeDependentAuc?.Horizon,
        TimeDependentAuc = performance?.TimeDependentAuc?.Auc,
        LogRankP = performance?.LogRank?.PValue,
        DiscoveryOutOfBagConcordance = model.OutOfBagConcordance,
        Warnings = [.. discoveryOverlap, .. scores.Warnings.Select(w => w.Message)],
    };
}
