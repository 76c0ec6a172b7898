using System.Security.Cryptography;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Locking;

/// <summary>
/// The locked-panel file, read and written in one place (layout in FORMAT.md beside this file):
/// <see cref="LockedPanelEnvelope"/> around the content of <see cref="LockedPanelJson"/>, with
/// the optional keys of <see cref="DiscoveryOverlap"/> and <see cref="MarkerLabels"/>. The
/// screen writes it into its results folder (<see cref="PanelLocking"/>); `apply` reads it.
/// </summary>
public static class LockedPanelFile
{
    /// <summary>The file name a results folder holds the locked panel under.</summary>
    public const string DefaultFileName = "locked_panel.json";

    /// <summary>Writes <see cref="DefaultFileName"/> into a results folder (atomically); returns its path.</summary>
    public static string WriteInto(string resultsFolder, LockedPanel panel)
    {
        ArgumentNullException.ThrowIfNull(resultsFolder);
        string path = Path.Combine(resultsFolder, DefaultFileName);
        Write(path, panel);
        return path;
    }

    public static void Write(string path, LockedPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        LockedPanelEnvelope.Write(path, LockedPanelJson.ToJson(panel));
    }

    /// <exception cref="Data.PanelInputException">The file is missing, not ours, changed, truncated or structurally invalid; the message names it.</exception>
    public static LockedPanel Read(string path) => LockedPanelEnvelope.Read(path, LockedPanelJson.FromJson);

    /// <summary>The panel and, when the screen recorded them, the SHA-256 of each discovery sample id.</summary>
    public static (LockedPanel Panel, HashSet<string>? DiscoverySampleIdHashes) ReadWithDiscoveryIds(string path) =>
        LockedPanelEnvelope.Read(path, content => (LockedPanelJson.FromJson(content), DiscoveryOverlap.ReadSampleIdHashes(content)));

    /// <summary>A locked panel of any outcome kind, with its hashed discovery sample ids and display names.</summary>
    /// <exception cref="Data.PanelInputException">The file is missing, not ours, changed, truncated or structurally invalid; the message names it.</exception>
    public static LoadedLockedPanel ReadAny(string path) => LockedPanelEnvelope.Read(path, content =>
    {
        var kind = LockedPanelJson.KindOf(content);
        return new LoadedLockedPanel
        {
            Kind = kind,
            Classes = kind == OutcomeKind.Classes ? LockedPanelJson.FromJson(content) : null,
            Measured = kind == OutcomeKind.Measured ? LockedPanelJson.MeasuredFromJson(content) : null,
            FollowUp = kind == OutcomeKind.TimeToEvent ? LockedPanelJson.FollowUpFromJson(content) : null,
            DiscoverySampleIdHashes = DiscoveryOverlap.ReadSampleIdHashes(content),
            DisplayNames = MarkerLabels.ReadDisplayNames(content),
        };
    });

    /// <summary>Writes a measured panel's file (format version <see cref="LockedPanelEnvelope.OutcomeKindsVersion"/>).</summary>
    public static void Write(string path, LockedMeasuredPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        LockedPanelEnvelope.Write(path, LockedPanelJson.ToJson(panel), LockedPanelEnvelope.OutcomeKindsVersion);
    }

    /// <summary>Writes a follow-up panel's file (format version <see cref="LockedPanelEnvelope.OutcomeKindsVersion"/>).</summary>
    public static void Write(string path, LockedFollowUpPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        LockedPanelEnvelope.Write(path, LockedPanelJson.ToJson(panel), LockedPanelEnvelope.OutcomeKindsVersion);
    }

    /// <summary>The markers' display names recorded when the panel was locked (id to name; empty when none were).</summary>
    public static Dictionary<string, string> ReadDisplayNames(string path) => LockedPanelEnvelope.Read(path, MarkerLabels.ReadDisplayNames);

    /// <summary>SHA-256 (lower-case hex) of a locked-panel file's bytes, for manifests.</summary>
    public static string FileSha256(string path)
    {
        using var stream = File.OpenRead(path);
        return Convert.ToHexStringLower(SHA256.HashData(stream));
    }
}
