using OmicsScreen.Data;
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
    public static string LockInto(string resultsFolder, LoadedPanel loaded, ScreenResult result, int? panelSize = null)
    {
        ArgumentNullException.ThrowIfNull(loaded);
        ArgumentNullException.ThrowIfNull(result);
        var screen = result.Settings.Options;
        var inputs = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var input in loaded.Inputs) inputs[Path.GetFileName(input.Path)] = input.Sha256;
        var locked = PanelLocker.Lock(loaded.Panel, result, new PanelLockOptions
        {
            PanelSize = panelSize,
            Seed = screen.Seed,
            TreeCount = screen.TreesPerForest,
            ThreadCount = screen.ThreadCount,
            ToolVersion = ToolVersion.Current,
            InputSha256 = inputs,
        });
        var content = LockedPanelJson.ToJson(locked);
        content[DiscoveryOverlap.SampleIdHashesKey] = DiscoveryOverlap.SampleIdHashes(loaded.Panel.Matrix.SampleIds);
        if (MarkerLabels.DisplayNames(loaded, locked.MarkerNames) is { } displayNames) content[MarkerLabels.DisplayNamesKey] = displayNames;
        LockedPanelEnvelope.Write(Path.Combine(resultsFolder, LockedPanelFile.DefaultFileName), content);
        return LockedPanelFile.DefaultFileName;
    }
}
