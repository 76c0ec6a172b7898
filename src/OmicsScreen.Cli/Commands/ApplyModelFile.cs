using System.Reflection;
using OmicsScreen.Data.Models;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Cli.Commands;

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

    public static void Write(string path, LockedPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        LockedPanelFile.Write(path, LockedPanelJson.ToJson(panel));
    }

    /// <exception cref="Data.PanelInputException">The file is missing, not ours, changed, truncated or structurally invalid; the message names it.</exception>
    public static LockedPanel Read(string path) => LockedPanelFile.Read(path, LockedPanelJson.FromJson);

    /// <summary>The version this program stamps into the panels it locks.</summary>
    public static string ToolVersion() =>
        typeof(ApplyModelFile).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";
}
