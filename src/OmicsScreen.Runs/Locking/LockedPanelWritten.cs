using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Locking;

/// <summary>What locking a screen's panel wrote, and what the screen report shows of the panel.</summary>
/// <param name="FileName">The locked panel's file name in the results folder.</param>
/// <param name="DiscoveryRiskGroups">For follow-up, the discovery samples' risk groups by out-of-bag risk score; null for other kinds.</param>
public sealed record LockedPanelWritten(string FileName, LockedFollowUpPerformance? DiscoveryRiskGroups);
