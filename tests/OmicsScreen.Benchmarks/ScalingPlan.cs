namespace OmicsScreen.Benchmarks;

/// <summary>
/// The points of the scaling suite: samples 250 ... 8,000 at 1,000 features, features 1,000 ...
/// 100,000 at 200 samples, and trees 125 ... 1,000 at 500 x 2,000, a shape on neither line, so
/// that the cost model fitted on the first two series can be checked on it.
/// </summary>
/// <remarks>
/// The largest points grow fewer trees than the screen's 500 to keep the suite within minutes on
/// a small machine; the report scales their time to 500 trees, which the trees series justifies
/// when its time exponent is close to 1.
/// </remarks>
public static class ScalingPlan
{
    public const int ScreenTrees = 500;

    /// <summary>A real default screen, small enough to run in a minute, for checking the screen cost model.</summary>
    public static ScreenCheckCase ScreenCheck { get; } = new(200, 2_000);

    /// <summary>The shapes the README projects to: a wide-cohort proteomics panel and a methylation-array-sized panel.</summary>
    public static IReadOnlyList<(int Samples, int Features)> Projections { get; } = [(50_000, 3_000), (1_000, 850_000)];

    public static IReadOnlyList<ScalingCase> Points { get; } =
    [
        new(ScalingSeries.Samples, 250, 1_000, 500),
        new(ScalingSeries.Samples, 500, 1_000, 500),
        new(ScalingSeries.Samples, 1_000, 1_000, 500),
        new(ScalingSeries.Samples, 2_000, 1_000, 250),
        new(ScalingSeries.Samples, 4_000, 1_000, 125),
        new(ScalingSeries.Samples, 8_000, 1_000, 60),
        new(ScalingSeries.Features, 200, 1_000, 500),
        new(ScalingSeries.Features, 200, 3_000, 500),
        new(ScalingSeries.Features, 200, 10_000, 500),
        new(ScalingSeries.Features, 200, 30_000, 500),
        new(ScalingSeries.Features, 200, 100_000, 250),
        new(ScalingSeries.Trees, 500, 2_000, 125),
        new(ScalingSeries.Trees, 500, 2_000, 250),
        new(ScalingSeries.Trees, 500, 2_000, 500),
        new(ScalingSeries.Trees, 500, 2_000, 1_000),
    ];

    /// <summary>The point of the given case name, or null.</summary>
    public static ScalingCase? Find(string name)
    {
        foreach (var point in Points) if (point.Name == name) return point;
        return null;
    }
}
