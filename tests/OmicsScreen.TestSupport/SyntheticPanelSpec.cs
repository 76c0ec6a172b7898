namespace OmicsScreen.TestSupport;

/// <summary>
/// The shape of a simulated omics panel: log-normal abundances, features in blocks that share a
/// latent factor (correlation BlockCorrelation on the log scale), and the first InformativeCount
/// features shifted by EffectSize standard deviations in one class each.
/// </summary>
public sealed record SyntheticPanelSpec
{
    public int SampleCount { get; init; } = 200;
    public int FeatureCount { get; init; } = 100;
    public int ClassCount { get; init; } = 2;
    /// <summary>Share of each class; null gives equal shares.</summary>
    public double[]? ClassFractions { get; init; }
    public int InformativeCount { get; init; } = 5;
    public double EffectSize { get; init; } = 1.0;
    public int BlockSize { get; init; } = 10;
    public double BlockCorrelation { get; init; } = 0.5;
    /// <summary>Fraction of cells set missing completely at random.</summary>
    public double MissingFraction { get; init; }
    public ulong Seed { get; init; } = 1;
}
