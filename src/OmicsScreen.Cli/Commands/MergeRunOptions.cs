namespace OmicsScreen.Cli.Commands;

/// <summary>Everything `merge` was asked to do.</summary>
public sealed record MergeRunOptions
{
    public required IReadOnlyList<string> PartFolders { get; init; }
    public required string OutputFolder { get; init; }
    public bool Force { get; init; }
    public bool Quiet { get; init; }
    public int ThreadCount { get; init; }
}
