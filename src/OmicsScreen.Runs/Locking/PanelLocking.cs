using System.Text.Json.Nodes;
using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Locking;

/// <summary>The screen's last step: lock the top of its shortlist for `apply`, with the discovery data's provenance.</summary>
public static class PanelLocking
{
    /// <summary>
    /// Locks the top of a finished screen (the screen's seed, trees per forest and threads; the
    /// recommended size unless <paramref name="panelSize"/> is given) with the discovery inputs'
    /// SHA-256, the hashed discovery sample ids and the markers' display names, and writes it into
    /// the results folder; returns the file name written.
    /// </summary>
    public static string LockInto(string resultsFolder, LoadedPanel loaded, ScreenResult result, int? panelSize = null) =>
        Lock(resultsFolder, loaded, result, panelSize).FileName;

    /// <summary>
    /// As <see cref="LockInto"/>, returning with the file name what the screen report draws of the
    /// locked panel: for follow-up, its discovery risk groups (<see cref="PanelLocker.DiscoveryRiskGroups"/>).
    /// </summary>
    public static LockedPanelWritten Lock(string resultsFolder, LoadedPanel loaded, ScreenResult result, int? panelSize = null)
    {
        ArgumentNullException.ThrowIfNull(loaded);
        ArgumentNullException.ThrowIfNull(result);
        var screen = result.Settings.Options;
        var inputs = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var input in loaded.Inputs) inputs[Path.GetFileName(input.Path)] = input.Sha256;
        var lockOptions = new PanelLockOptions
        {
            PanelSize = panelSize,
            Seed = screen.Seed,
            TreeCount = screen.TreesPerForest,
            ThreadCount = screen.ThreadCount,
            ToolVersion = ToolVersion.Current,
            InputSha256 = inputs,
        };
        // Class panels keep format version 1 and their exact bytes; the other kinds need version 2.
        LockedFollowUpPerformance? riskGroups = null;
        (JsonObject Content, IReadOnlyList<string> Markers, int Version) written;
        switch (loaded.Panel.Kind)
        {
            case OutcomeKind.Measured:
                written = Content(PanelLocker.LockMeasured(loaded.Panel, result, lockOptions));
                break;
            case OutcomeKind.TimeToEvent:
                var (followUp, groups) = PanelLocker.LockFollowUpWithRiskGroups(loaded.Panel, result, lockOptions);
                written = Content(followUp);
                riskGroups = groups;
                break;
            default:
                written = Content(PanelLocker.Lock(loaded.Panel, result, lockOptions));
                break;
        }
        var (content, markers, version) = written;
        content[DiscoveryOverlap.SampleIdHashesKey] = DiscoveryOverlap.SampleIdHashes(loaded.Panel.Matrix.SampleIds);
        if (MarkerLabels.DisplayNames(loaded, markers) is { } displayNames) content[MarkerLabels.DisplayNamesKey] = displayNames;
        LockedPanelEnvelope.Write(Path.Combine(resultsFolder, LockedPanelFile.DefaultFileName), content, version);
        return new LockedPanelWritten(LockedPanelFile.DefaultFileName, riskGroups);
    }

    private static (JsonObject Content, IReadOnlyList<string> Markers, int Version) Content(LockedPanel panel) =>
        (LockedPanelJson.ToJson(panel), panel.MarkerNames, LockedPanelEnvelope.FormatVersion);

    private static (JsonObject Content, IReadOnlyList<string> Markers, int Version) Content(LockedMeasuredPanel panel) =>
        (LockedPanelJson.ToJson(panel), panel.MarkerNames, LockedPanelEnvelope.OutcomeKindsVersion);

    private static (JsonObject Content, IReadOnlyList<string> Markers, int Version) Content(LockedFollowUpPanel panel) =>
        (LockedPanelJson.ToJson(panel), panel.MarkerNames, LockedPanelEnvelope.OutcomeKindsVersion);
}
