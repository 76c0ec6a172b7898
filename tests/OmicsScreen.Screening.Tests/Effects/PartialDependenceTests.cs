using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Effects;

namespace OmicsScreen.Screening.Tests.Effects;

/// <summary>
/// Partial dependence (Friedman 2001) and individual conditional expectation curves (Goldstein et
/// al. 2015) against hand computation on a tiny hand-built forest (issue 19 asks for exactly this),
/// and the shape words read off forests grown on simulated markers with a known shape.
/// </summary>
public class PartialDependenceTests
{
    /// <summary>Four samples, two features with exact bins: f0 = 1, 2, 3, 4 and f1 = 10, 20, 10, 20.</summary>
    private static (FeatureMatrix Raw, BinnedMatrix Binned) TinyPanel()
    {
        var builder = new FeatureMatrixBuilder(["f0", "f1"], ["a", "b", "c", "d"]);
        float[] f0 = [1, 2, 3, 4], f1 = [10, 20, 10, 20];
        for (int s = 0; s < 4; s++) { builder.SetMeasured(0, s, f0[s]); builder.SetMeasured(1, s, f1[s]); }
        var raw = builder.Build();
        return (raw, new BinMapper().Bin(raw));
    }

    /// <summary>A stump on one feature: code &lt;= binThreshold goes left. Node values: root (unused), left, right.</summary>
    private static TreeLeafValues Stump(int feature, byte binThreshold, float threshold, double left, double right) =>
        new(new SplitTopology([feature, -1, -1], [binThreshold, 0, 0], [threshold, float.NaN, float.NaN], [254, 0, 0],
            [UnmeasuredRouting.BothRight, UnmeasuredRouting.BothRight, UnmeasuredRouting.BothRight], [1, 0, 0], [2, 0, 0], [4, 2, 2]),
            [0, left, right]);

    [Fact]
    public void Tiny_forest_partial_dependence_equals_the_hand_computation()
    {
        var (raw, binned) = TinyPanel();
        // Tree 1 on f0: f0 <= 2 (bin code 1) -> 0, else 1. Tree 2 on f1: f1 <= 10 (code 0) -> 0.2, else 0.6.
        var trees = new[] { Stump(0, 1, 2.5f, 0, 1), Stump(1, 0, 15f, 0.2, 0.6) };
        var curve = PartialDependence.Compute(trees, raw, binned, feature: 0, threadCount: 1);
        // By hand: with f0 set to v, tree 1 gives [v > 2]; tree 2 gives 0.2, 0.6, 0.2, 0.6 for samples
        // a-d whatever v is. A sample's ICE at v is ([v > 2] + tree 2) / 2; the PD is their mean:
        // v = 1, 2: (0 + 0.4) / 2 = 0.2; v = 3, 4: (1 + 0.4) / 2 = 0.7.
        Assert.Equal([1.0, 2, 3, 4], curve.GridValues);
        Assert.Equal([0.2, 0.2, 0.7, 0.7], curve.Average.Select(v => Math.Round(v, 12)).ToArray());
        // ICE of sample b (tree 2 gives 0.6): 0.3, 0.3, 0.8, 0.8.
        Assert.Equal([0.3, 0.3, 0.8, 0.8], curve.Individual.Skip(4).Take(4).Select(v => Math.Round(v, 12)).ToArray());
        // 10th and 90th percentiles (type 7) over the four samples at v = 1: ICE values 0.1, 0.3, 0.1, 0.3.
        Assert.Equal(0.1, curve.Lower[0], 12);
        Assert.Equal(0.3, curve.Upper[0], 12);
        var shape = EffectShapeReader.Read(curve, smallestEffect: 0.05);
        Assert.Equal(EffectShapeKind.RisesAbove, shape.Kind);
        Assert.Equal(2.5, shape.Step, 12);
        Assert.Equal("rises above about 2.5", shape.Description);
        // Partial dependence on f1 is flat in f0's sense: 0.2 + 0.5 * 0.5 ... by hand (mean of tree 1 = 0.5):
        // v = 10: (0.5 + 0.2) / 2 = 0.35; v = 20: (0.5 + 0.6) / 2 = 0.55.
        var other = PartialDependence.Compute(trees, raw, binned, feature: 1, threadCount: 1);
        Assert.Equal([0.35, 0.55], other.Average.Select(v => Math.Round(v, 12)).ToArray());
    }

    private const int NoiseFeatures = 8;

    /// <summary>A marker uniform on [0, 10] with the given effect on y, beside 8 unrelated N(0, 1) features; noise SD 0.3.</summary>
    private static (FeatureMatrix Raw, BinnedMatrix Binned, double[] Y) Simulated(ulong seed, Func<double, double> effect, int samples = 400)
    {
        var generator = new Xoshiro256StarStar(seed);
        var names = new[] { "marker" }.Concat(Enumerable.Range(1, NoiseFeatures).Select(i => $"noise{i}")).ToArray();
        var builder = new FeatureMatrixBuilder(names, Enumerable.Range(0, samples).Select(i => $"s{i}").ToArray());
        var y = new double[samples];
        for (int s = 0; s < samples; s++)
        {
            double x = generator.NextDouble() * 10;
            builder.SetMeasured(0, s, (float)x);
            for (int f = 1; f <= NoiseFeatures; f++) builder.SetMeasured(f, s, (float)generator.NextGaussian());
            y[s] = effect(x) + 0.3 * generator.NextGaussian();
        }
        var raw = builder.Build();
        return (raw, new BinMapper().Bin(raw), y);
    }

    private static EffectShape ShapeOf(ulong seed, Func<double, double> effect, out EffectCurve curve)
    {
        var (raw, binned, y) = Simulated(seed, effect);
        var forest = RegressionForestTrainer.Train(binned, y, new ForestOptions
        {
            TreeCount = 200, Seed = seed, ThreadCount = 1, Tree = new TreeOptions { MinLeafSize = 5 },
        });
        var trees = TreeLeafValues.OfRegressionForest(forest);
        curve = PartialDependence.Compute(trees, raw, binned, 0, threadCount: 1);
        // Smallest effect worth naming: twice the largest range the unrelated features' curves reach
        // in the same forest (the rule EffectShapeReader's remarks suggest).
        double noiseRange = Enumerable.Range(1, NoiseFeatures).Max(f => PartialDependence.Compute(trees, raw, binned, f, threadCount: 1).Range);
        return EffectShapeReader.Read(curve, 2 * noiseRange);
    }

    [Theory]
    [InlineData(1UL)]
    [InlineData(2UL)]
    [InlineData(3UL)]
    public void A_planted_threshold_is_found_within_one_grid_step(ulong seed)
    {
        // y steps up by 1 when the marker passes 6.0 (a threshold effect, no trend either side).
        var shape = ShapeOf(seed, x => x > 6.0 ? 1 : 0, out var curve);
        Assert.Equal(EffectShapeKind.RisesAbove, shape.Kind);
        int at = Array.FindIndex(curve.GridValues, v => v >= shape.Step);
        double step = curve.GridValues[at] - curve.GridValues[at - 1];
        Assert.InRange(shape.Step, 6.0 - step, 6.0 + step);
    }

    [Theory]
    [InlineData(11UL)]
    [InlineData(12UL)]
    public void A_planted_class_threshold_is_found_within_one_grid_step_on_the_class_probability(ulong seed)
    {
        // Classes: P(class 1) = 0.85 above 6.0 and 0.15 below (a threshold, no trend either side);
        // the curve is the forest's probability of class 1 (each leaf's class share).
        var (raw, binned, y) = Simulated(seed, x => x > 6.0 ? 1 : 0);
        var draws = new Xoshiro256StarStar(seed + 100);
        var classes = y.Select(v => draws.NextDouble() < (v > 0.5 ? 0.85 : 0.15) ? 1 : 0).ToArray();
        var forest = ForestTrainer.Train(binned, new ClassOutcome("y", ["a", "b"], classes, 1),
            new ForestOptions { TreeCount = 200, Seed = seed, ThreadCount = 1, Tree = new TreeOptions { MinLeafSize = 5 } });
        var trees = TreeLeafValues.OfClassForest(forest, 1);
        var curve = PartialDependence.Compute(trees, raw, binned, 0, threadCount: 1);
        Assert.All(curve.Average, p => Assert.InRange(p, 0, 1));
        double noiseRange = Enumerable.Range(1, NoiseFeatures).Max(f => PartialDependence.Compute(trees, raw, binned, f, threadCount: 1).Range);
        var shape = EffectShapeReader.Read(curve, 2 * noiseRange);
        Assert.Equal(EffectShapeKind.RisesAbove, shape.Kind);
        int at = Array.FindIndex(curve.GridValues, v => v >= shape.Step);
        double step = curve.GridValues[at] - curve.GridValues[at - 1];
        Assert.InRange(shape.Step, 6.0 - step, 6.0 + step);
    }

    [Fact]
    public void Linear_u_shaped_and_absent_effects_read_as_such()
    {
        // y = 0.3 x, -0.3 x, 0.1 (x - 5)^2 and 0 plus N(0, 0.3^2) noise.
        Assert.Equal(EffectShapeKind.Rises, ShapeOf(4, x => 0.3 * x, out _).Kind);
        Assert.Equal(EffectShapeKind.Falls, ShapeOf(5, x => -0.3 * x, out _).Kind);
        Assert.Equal(EffectShapeKind.UShaped, ShapeOf(6, x => 0.1 * (x - 5) * (x - 5), out _).Kind);
        Assert.Equal(EffectShapeKind.NoneOnItsOwn, ShapeOf(7, _ => 0, out _).Kind);
    }

    [Fact]
    public void Curves_do_not_depend_on_the_thread_count()
    {
        var (raw, binned, y) = Simulated(8, x => x);
        var forest = RegressionForestTrainer.Train(binned, y, new ForestOptions { TreeCount = 50, Seed = 8, ThreadCount = 1 });
        var trees = TreeLeafValues.OfRegressionForest(forest);
        var one = PartialDependence.Compute(trees, raw, binned, 0, threadCount: 1);
        var two = PartialDependence.Compute(trees, raw, binned, 0, threadCount: 2);
        Assert.Equal(one.Individual, two.Individual);
        Assert.Equal(one.Average, two.Average);
    }
}
