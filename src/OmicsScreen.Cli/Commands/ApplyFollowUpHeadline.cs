using OmicsScreen.Runs.Apply;

namespace OmicsScreen.Cli.Commands;

/// <summary>What `apply --json` prints for a panel locked on a time to an event.</summary>
public sealed record ApplyFollowUpHeadline : ApplyHeadline
{
    private ApplyFollowUpHeadline(FollowUpApplied applied) : base(applied)
    {
    }

    public string OutcomeKind { get; init; } = "time_to_event";
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

    public static ApplyFollowUpHeadline Of(FollowUpApplied applied)
    {
        var (model, scores, performance) = (applied.Model, applied.Scores, applied.Performance);
        return new ApplyFollowUpHeadline(applied)
        {
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
        };
    }
}
