namespace OmicsScreen.Benchmarks;

/// <summary>The quantity a scaling series varies while the others stay fixed.</summary>
public enum ScalingSeries
{
    Samples,
    Features,
    Trees,
}
