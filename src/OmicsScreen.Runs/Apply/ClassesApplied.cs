using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>A panel locked on classes, applied: class probabilities and calls, and with the classes known the AUC, error and calibration.</summary>
public sealed record ClassesApplied(string Folder, IReadOnlyList<string> DiscoveryOverlap, IReadOnlyDictionary<string, string> DisplayNames,
    LockedPanel Model, LockedPanelScores Scores, LockedPanelPerformance? Performance) : AppliedPanel(Folder, DiscoveryOverlap, DisplayNames)
{
    public override int SampleCount => Scores.SampleCount;
    public override IReadOnlyList<string> Markers => Model.MarkerNames;
    public override IReadOnlyList<ScaleWarning> ScaleWarnings => Scores.Warnings;
}
