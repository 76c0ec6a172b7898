using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Locking;

/// <summary>How a locked follow-up panel did on a cohort whose follow-up is known.</summary>
/// <param name="Concordance">Harrell's C of the risk score, with its infinitesimal-jackknife interval.</param>
/// <param name="TimeDependentAuc">The cumulative/dynamic AUC at the horizon asked for; null when none was.</param>
/// <param name="LowRisk">Kaplan-Meier curve of the low-risk group (null when the group is empty).</param>
/// <param name="HighRisk">Kaplan-Meier curve of the high-risk group (null when the group is empty).</param>
/// <param name="LogRank">The log-rank test of high against low risk; null when a group is empty.</param>
public sealed record LockedFollowUpPerformance(
    int SampleCount,
    int EventCount,
    int HighRiskCount,
    int HighRiskEventCount,
    ConcordanceEstimate Concordance,
    TimeDependentAucEstimate? TimeDependentAuc,
    SurvivalCurve? LowRisk,
    SurvivalCurve? HighRisk,
    LogRankResult? LogRank);
