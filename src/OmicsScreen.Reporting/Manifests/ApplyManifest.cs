namespace OmicsScreen.Reporting.Manifests;

/// <summary>
/// The manifest of `apply` (manifest.json, written last into its results folder): the locked
/// panel it used, the cohort's inputs with their SHA-256, the command line and what it wrote.
/// Its "command" tells a results folder of `apply` from a screen's.
/// </summary>
public sealed record ApplyManifest
{
    public const string CommandName = "apply";

    public string Tool { get; init; } = ManifestTool.Name;
    public required string Version { get; init; }
    public string Command { get; init; } = CommandName;

    /// <summary>The command as typed, quoted so it can be pasted into a shell.</summary>
    public required string CommandLine { get; init; }

    public required string StartedUtc { get; init; }
    public required string FinishedUtc { get; init; }
    public required ManifestLockedPanel Model { get; init; }
    public required IReadOnlyList<ManifestInput> Inputs { get; init; }
    public required IReadOnlyList<string> Outputs { get; init; }
}
