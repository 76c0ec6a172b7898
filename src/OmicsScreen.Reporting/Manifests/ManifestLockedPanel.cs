using System.Text.Json.Serialization;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>The locked panel `apply` scored with, as its manifest records it.</summary>
public sealed record ManifestLockedPanel
{
    public required string Path { get; init; }

    /// <summary>SHA-256 of the locked-panel file's bytes.</summary>
    public required string Sha256 { get; init; }

    public required IReadOnlyList<string> Markers { get; init; }

    /// <summary>Marker id to the lab-facing name recorded when the panel was locked; empty when none were.</summary>
    public required IReadOnlyDictionary<string, string> MarkerDisplayNames { get; init; }

    /// <summary>Discovery input file name to SHA-256, as the locked panel records them.</summary>
    public required IReadOnlyDictionary<string, string> DiscoveryInputsSha256 { get; init; }

    /// <summary>`measured` or `time_to_event`; left out for class panels, whose manifests read as before.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public string? OutcomeKind { get; init; }
}
