using OmicsScreen.Engine.Panels;

namespace OmicsScreen.TestSupport;

/// <summary>
/// The simulated panels on which our forest's out-of-bag error is compared with general-purpose
/// libraries (issue 15): the benchmark's three shapes and, scaled down so a unit test runs in
/// seconds, three small ones of the same aspect (wide, square-ish, tall). All use the planted
/// marker design of the forest benchmark: 10 markers shifted by one SD, correlated blocks of 10.
/// </summary>
public static class ForestReferenceShapes
{
    /// <summary>Shapes of reference/forest/oob_reference.json, made by make_reference.py.</summary>
    public static IReadOnlyList<(string Name, int SampleCount, int FeatureCount)> Small { get; } =
    [
        ("wide-60x2000", 60, 2_000),
        ("middle-200x400", 200, 400),
        ("tall-800x60", 800, 60),
    ];

    /// <summary>The forest benchmark's shapes.</summary>
    public static IReadOnlyList<(string Name, int SampleCount, int FeatureCount)> Benchmark { get; } =
    [
        ("forest-200x20000", 200, 20_000),
        ("forest-1000x2000", 1_000, 2_000),
        ("forest-4000x500", 4_000, 500),
    ];

    public static Panel Generate(int sampleCount, int featureCount) => SyntheticPanel.Generate(new SyntheticPanelSpec
    {
        SampleCount = sampleCount,
        FeatureCount = featureCount,
        InformativeCount = 10,
        EffectSize = 1.0,
        Seed = 42,
    });
}
