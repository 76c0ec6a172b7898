using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>A panel locked on a time to an event, applied: risk scores and groups, and with follow-up known the concordance, time-dependent AUC and risk groups' survival.</summary>
public sealed record FollowUpApplied(string Folder, IReadOnlyList<string> DiscoveryOverlap, IReadOnlyDictionary<string, string> DisplayNames,
    LockedFollowUpPanel Model, LockedFollowUpScores Scores, LockedFollowUpPerformance? Performance) : AppliedPanel(Folder, DiscoveryOverlap, DisplayNames)
{
    public override int SampleCount => Scores.SampleCount;
    public override IReadOnlyList<string> Markers => Model.MarkerNames;
    public override IReadOnlyList<ScaleWarning> ScaleWarnings => Scores.Warnings;
}
