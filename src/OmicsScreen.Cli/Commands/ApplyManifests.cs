using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Runs;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Output;
using OmicsScreen.Runs.Results;

namespace OmicsScreen.Cli.Commands;

/// <summary>The manifest `apply` writes last for a measured or time-to-event panel (the class path writes its own, unchanged).</summary>
internal static class ApplyManifests
{
    public static void Write(ResultsFolder folder, ApplyRunOptions options, LoadedLockedPanel stored, IReadOnlyList<InputFileRecord> inputs, DateTimeOffset started)
    {
        var manifest = new ApplyManifest
        {
            Version = ToolVersion.Current,
            CommandLine = ShellWords.Join(options.CommandLine),
            StartedUtc = started.ToString("O"),
            FinishedUtc = DateTimeOffset.UtcNow.ToString("O"),
            Model = new ManifestLockedPanel
            {
                Path = options.ModelPath,
                Sha256 = LockedPanelFile.FileSha256(options.ModelPath),
                Markers = stored.MarkerNames,
                MarkerDisplayNames = stored.DisplayNames,
                DiscoveryInputsSha256 = stored.Provenance.InputSha256,
                OutcomeKind = stored.Kind == OutcomeKind.Measured ? LockedPanelJson.MeasuredKind : LockedPanelJson.TimeToEventKind,
            },
            Inputs = inputs.Select(i => new ManifestInput(i.Path, i.ByteCount, i.Sha256)).ToArray(),
            Outputs = folder.WrittenFiles.ToArray(),
        };
        folder.WriteText(ResultsFolder.ManifestFileName, w => ManifestJson.Write(w, manifest));
    }
}
