namespace OmicsScreen.Reporting.Manifests;

/// <summary>An input file of a run as the manifest records it.</summary>
public sealed record ManifestInput(string Path, long Bytes, string Sha256);
