using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// Everything the HTML report of a screen shows. The report is a pure function of this record:
/// nothing is read from the clock, the machine or the file system, so the same input gives the
/// same bytes.
/// </summary>
/// <param name="Panel">The screened panel: class names and counts, cohorts, and the values of the top markers.</param>
/// <param name="Result">The screen's result records.</param>
/// <param name="Inputs">The input files (matrix, sample sheet) with their SHA-256.</param>
/// <param name="PanelLayout">How the matrix file is laid out (for example "SamplesInRows").</param>
/// <param name="Tables">The result tables written beside the report, with their SHA-256.</param>
/// <param name="CommandLine">The command that reruns the screen, already quoted for a shell.</param>
/// <param name="SoftwareVersion">Version of the program that ran the screen.</param>
/// <param name="Started">When the run started (UTC).</param>
/// <param name="Finished">When the screen finished, before the report was written (UTC).</param>
/// <param name="LoadSeconds">Wall time of reading and checking the inputs.</param>
/// <param name="Cores">Logical processors of the machine.</param>
/// <param name="Threads">Threads the forests used.</param>
/// <param name="ShowSampleIds">When false (the default), no sample identifier appears anywhere in the report.</param>
/// <param name="MergedParts">When above 0, the run was split into this many parts on separate processes and merged.</param>
/// <param name="Warnings">What the run warned about (the loader's warnings, weak settings), as printed on the console; null or empty for none.</param>
/// <param name="LockedRiskGroups">For follow-up, the locked panel's discovery risk groups (out-of-bag risk against the panel's cut); null otherwise or when nothing was locked.</param>
public sealed record ScreenReportInput(
    Panel Panel,
    ScreenResult Result,
    IReadOnlyList<ReportedFile> Inputs,
    string PanelLayout,
    IReadOnlyList<ReportedFile> Tables,
    string CommandLine,
    string SoftwareVersion,
    DateTimeOffset Started,
    DateTimeOffset Finished,
    double LoadSeconds,
    int Cores,
    int Threads,
    bool ShowSampleIds = false,
    int MergedParts = 0,
    IReadOnlyList<string>? Warnings = null,
    FeatureLabels? Labels = null,
    LockedFollowUpPerformance? LockedRiskGroups = null)
{
    /// <summary>The features' lab-facing names and annotations; none when the inputs gave none.</summary>
    public FeatureLabels FeatureLabels => Labels ?? FeatureLabels.None;

    /// <summary>File name of the manifest the report points to; it sits beside the report.</summary>
    public const string ManifestFileName = "manifest.json";
}
