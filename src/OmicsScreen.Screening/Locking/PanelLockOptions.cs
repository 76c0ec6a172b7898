namespace OmicsScreen.Screening.Locking;

/// <summary>How to lock a panel from a screen.</summary>
public sealed record PanelLockOptions
{
    /// <summary>Markers to keep; null takes the screen's recommended size, else the shortlist length (at least 1).</summary>
    public int? PanelSize { get; init; }

    public ulong Seed { get; init; } = 1;

    public int TreeCount { get; init; } = 500;

    /// <summary>Worker threads; 0 uses every core. Never changes the locked forest.</summary>
    public int ThreadCount { get; init; }

    public string ToolVersion { get; init; } = "unknown";

    /// <summary>Discovery input file name to SHA-256, recorded in the provenance.</summary>
    public IReadOnlyDictionary<string, string> InputSha256 { get; init; } = new Dictionary<string, string>();

    public void Validate()
    {
        if (PanelSize is < 1) throw new ArgumentException("A locked panel needs at least one marker.");
        if (TreeCount < 1) throw new ArgumentException("A locked forest needs at least one tree.");
        if (ThreadCount < 0) throw new ArgumentException("The thread count cannot be negative.");
    }
}
