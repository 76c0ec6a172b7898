namespace OmicsScreen.Reporting.Manifests;

/// <summary>What every manifest of ours names as its tool; how a results folder is recognised as ours.</summary>
public static class ManifestTool
{
    public const string Name = "omicsscreen";
}
