namespace OmicsScreen.Screening.Locking;

/// <summary>Where a locked panel came from, so a validation report can name the exact discovery run.</summary>
/// <param name="ToolVersion">Version of the program that locked the panel.</param>
/// <param name="Seed">Run seed of the screen and of the locked forest.</param>
/// <param name="PanelSize">Markers kept from the top of the screen's order.</param>
/// <param name="TreeCount">Trees in the locked forest.</param>
/// <param name="DiscoverySampleCount">Samples the locked forest was grown on.</param>
/// <param name="InputSha256">Discovery input file name to SHA-256 (lower-case hex), as given by the caller.</param>
public sealed record LockProvenance(
    string ToolVersion,
    ulong Seed,
    int PanelSize,
    int TreeCount,
    int DiscoverySampleCount,
    IReadOnlyDictionary<string, string> InputSha256);
