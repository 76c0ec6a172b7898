using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>A panel locked on a measured outcome, applied: predictions, and with the outcome known R², RMSE and the calibration line.</summary>
public sealed record MeasuredApplied(string Folder, IReadOnlyList<string> DiscoveryOverlap, IReadOnlyDictionary<string, string> DisplayNames,
    LockedMeasuredPanel Model, LockedMeasuredScores Scores, LockedMeasuredPerformance? Performance) : AppliedPanel(Folder, DiscoveryOverlap, DisplayNames)
{
    public override int SampleCount => Scores.SampleCount;
    public override IReadOnlyList<string> Markers => Model.MarkerNames;
    public override IReadOnlyList<ScaleWarning> ScaleWarnings => Scores.Warnings;
}
