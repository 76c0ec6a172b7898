using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>
/// evaluation.json of `apply` for a panel locked on a time to an event, with follow-up known:
/// Harrell's C with its interval, the time-dependent AUC at the horizon asked for, the risk groups
/// with the log-rank test between them, and the warnings that qualify them.
/// </summary>
public sealed record ApplyFollowUpEvaluation
{
    public string Tool { get; init; } = ManifestTool.Name;
    public string OutcomeKind { get; init; } = "time_to_event";
    public required int Samples { get; init; }
    public required int Events { get; init; }
    public required EvaluationEstimate Concordance { get; init; }
    public required EvaluationTimeDependentAuc? TimeDependentAuc { get; init; }
    public required double RiskGroupCut { get; init; }
    public required IReadOnlyList<EvaluationRiskGroup> RiskGroups { get; init; }
    public required double? LogRankChiSquare { get; init; }
    public required double? LogRankP { get; init; }
    public required double DiscoveryOutOfBagConcordance { get; init; }
    public required IReadOnlyList<EvaluationScaleWarning> ScaleWarnings { get; init; }
    public required IReadOnlyList<string> DiscoveryOverlapWarnings { get; init; }

    public const string ConcordanceMethod = "Harrell's C; infinitesimal-jackknife standard error, normal interval";

    public const string TimeDependentAucMethod =
        "cumulative/dynamic AUC (Heagerty, Lumley & Pepe 2000) with inverse-probability-of-censoring weights from the Kaplan-Meier estimate of the censoring times (Uno et al. 2007; Blanche et al. 2013)";

    public static ApplyFollowUpEvaluation Of(LockedFollowUpPanel model, LockedFollowUpScores scores, LockedFollowUpPerformance performance,
        IReadOnlyList<string> overlap) => new()
    {
        Samples = performance.SampleCount,
        Events = performance.EventCount,
        Concordance = new EvaluationEstimate(performance.Concordance.Concordance, performance.Concordance.Interval.Lower,
            performance.Concordance.Interval.Upper, performance.Concordance.Interval.Level, ConcordanceMethod),
        TimeDependentAuc = performance.TimeDependentAuc is { } auc
            ? new EvaluationTimeDependentAuc(auc.Horizon, auc.Auc, auc.Cases, auc.Controls, auc.CensoredBeforeHorizon, TimeDependentAucMethod)
            : null,
        RiskGroupCut = model.RiskGroupCut,
        RiskGroups =
        [
            Group("low", performance.SampleCount - performance.HighRiskCount, performance.EventCount - performance.HighRiskEventCount, performance.LowRisk),
            Group("high", performance.HighRiskCount, performance.HighRiskEventCount, performance.HighRisk),
        ],
        LogRankChiSquare = performance.LogRank?.ChiSquare,
        LogRankP = performance.LogRank?.PValue,
        DiscoveryOutOfBagConcordance = model.OutOfBagConcordance,
        ScaleWarnings = scores.Warnings.Select(w => new EvaluationScaleWarning(w.Marker, w.Unmeasured, w.Message)).ToArray(),
        DiscoveryOverlapWarnings = overlap,
    };

    private static EvaluationRiskGroup Group(string name, int samples, int events, SurvivalCurve? curve) =>
        new(name, samples, events, curve is null || double.IsNaN(curve.Median) ? null : curve.Median);
}
