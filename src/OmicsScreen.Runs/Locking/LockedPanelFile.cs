using System.Security.Cryptography;
using OmicsScreen.Data;
using OmicsScreen.Data.Models;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Locking;

/// <summary>
/// A locked panel on disk: the file envelope of <see cref="LockedPanelFile"/> around the
/// content of <see cref="LockedPanelJson"/>. The screen writes it into its results folder; the
/// apply verb reads it.
/// </summary>
public static class ApplyModelFile
{
    /// <summary>Writes <see cref="LockedPanelFile.DefaultFileName"/> into a results folder (atomically); returns its path.</summary>
    public static string WriteInto(string resultsFolder, LockedPanel panel)
    {
        ArgumentNullException.ThrowIfNull(resultsFolder);
        string path = Path.Combine(resultsFolder, LockedPanelFile.DefaultFileName);
        Write(path, panel);
        return path;
    }

    /// <summary>
    /// Locks the top of a finished screen (the screen's seed, trees per forest and threads; the
    /// recommended size unless <paramref name="panelSize"/> is given) with the discovery inputs'
    /// SHA-256 as provenance, and writes it into the results folder; returns the file name written.
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
            ToolVersion = Runs.ToolVersion.Current,
            InputSha256 = inputs,
        });
        var content = LockedPanelJson.ToJson(locked);
        content[DiscoveryOverlap.SampleIdHashesKey] = DiscoveryOverlap.SampleIdHashes(loaded.Panel.Matrix.SampleIds);
        if (MarkerLabels.DisplayNames(loaded, locked.MarkerNames) is { } displayNames) content[MarkerLabels.DisplayNamesKey] = displayNames;
        LockedPanelFile.Write(Path.Combine(resultsFolder, LockedPanelFile.DefaultFileName), content);
        return LockedPanelFile.DefaultFileName;
    }

    public static void Write(string path, LockedPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        LockedPanelFile.Write(path, LockedPanelJson.ToJson(panel));
    }

    /// <exception cref="Data.PanelInputException">The file is missing, not ours, changed, truncated or structurally invalid; the message names it.</exception>
    public static LockedPanel Read(string path) => LockedPanelFile.Read(path, LockedPanelJson.FromJson);

    /// <summary>The panel and, when the screen recorded them, the SHA-256 of each discovery sample id.</summary>
    public static (LockedPanel Panel, HashSet<string>? DiscoverySampleIdHashes) ReadWithDiscoveryIds(string path) =>
        LockedPanelFile.Read(path, content => (LockedPanelJson.FromJson(content), DiscoveryOverlap.ReadSampleIdHashes(content)));

    /// <summary>The markers' display names recorded when the panel was locked (id to name; empty when none were).</summary>
    public static Dictionary<string, string> ReadDisplayNames(string path) => LockedPanelFile.Read(path, MarkerLabels.ReadDisplayNames);

    /// <summary>SHA-256 (lower-case hex) of a model file's bytes, for manifests.</summary>
    public static string FileSha256(string path)
    {
        using var stream = File.OpenRead(path);
        return Convert.ToHexStringLower(SHA256.HashData(stream));
    }
}
