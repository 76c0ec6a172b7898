namespace OmicsScreen.Reporting.Manifests;

/// <summary>An outcome class and how many samples it holds.</summary>
public sealed record ManifestClass(string Name, int Samples);
