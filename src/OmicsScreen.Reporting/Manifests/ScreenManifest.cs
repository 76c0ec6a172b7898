namespace OmicsScreen.Reporting.Manifests;

/// <summary>
/// The manifest of a screen (manifest.json, written last into its results folder): inputs with
/// their SHA-256, the software version, every parameter (defaults included) and seed, the
/// command line to repeat it, timings, and the headline results. Written by
/// <see cref="Json.ManifestJson"/>, which puts the properties in ordinal order of their
/// snake_case names, so the order of declaration here does not matter.
/// </summary>
public sealed record ScreenManifest
{
    public string Tool { get; init; } = ManifestTool.Name;
    public required string Version { get; init; }

    /// <summary>The command as typed, quoted so it can be pasted into a shell.</summary>
    public required string CommandLine { get; init; }

    /// <summary>A merged run names its part count (its command line is the single run it equals); null otherwise.</summary>
    public int? MergedFromParts { get; init; }

    public required string StartedUtc { get; init; }
    public required string FinishedUtc { get; init; }
    public required int Cores { get; init; }
    public required int Threads { get; init; }

    /// <summary>Wall time of each stage that ran and of loading, in seconds rounded to milliseconds.</summary>
    public required Dictionary<string, double> Seconds { get; init; }

    public required IReadOnlyList<ManifestInput> Inputs { get; init; }
    public required ManifestPanel Panel { get; init; }

    /// <summary>One key per option of `screen` (the option without its dashes), with automatic values resolved.</summary>
    public required Dictionary<string, object?> Parameters { get; init; }

    public required ManifestResolved Resolved { get; init; }
    public required ManifestResults Results { get; init; }
    public required IReadOnlyList<string> Outputs { get; init; }

    /// <summary>The loader's warnings and the settings that are legal but weak, as printed before the run.</summary>
    public required IReadOnlyList<string> Warnings { get; init; }

    public string Caution { get; init; } =
        "Research use only. A screen is not a diagnostic test; confirm markers in independent cohorts and follow local ethics, data-protection rules and licensed clinical practice.";
}
