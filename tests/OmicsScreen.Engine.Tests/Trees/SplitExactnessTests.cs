using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Tests.Trees;

public class SplitExactnessTests
{
    /// <summary>Small integer-valued data, so many thresholds and features tie; some cells unmeasured.</summary>
    private static (FeatureMatrix Matrix, int[] Classes) RandomData(ulong seed, int sampleCount, int featureCount,
        int classCount, int levels, double unmeasuredFraction)
    {
        var generator = new Xoshiro256StarStar(seed);
        var names = Enumerable.Range(0, featureCount).Select(i => $"f{i}").ToArray();
        var ids = Enumerable.Range(0, sampleCount).Select(i => $"s{i}").ToArray();
        var builder = new FeatureMatrixBuilder(names, ids);
        for (int f = 0; f < featureCount; f++)
            for (int s = 0; s < sampleCount; s++)
            {
                double u = generator.NextDouble();
                if (u < unmeasuredFraction / 2) builder.SetMissing(f, s);
                else if (u < unmeasuredFraction) builder.SetBelowDetection(f, s, float.NaN);
                else builder.SetMeasured(f, s, generator.NextInt(levels) * 0.5f);
            }
        var classes = new int[sampleCount];
        for (int s = 0; s < sampleCount; s++) classes[s] = generator.NextInt(classCount);
        return (builder.Build(), classes);
    }

    /// <summary>The best Gini proxy over thresholds between sorted distinct raw values, done the textbook way.</summary>
    private static double BestScoreFromSortedRawValues(FeatureMatrix matrix, int[] classes, double[] weights, int classCount)
    {
        double best = double.NegativeInfinity;
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            var measured = Enumerable.Range(0, matrix.SampleCount)
                .Where(s => matrix.State(f, s) == CellState.Measured).Select(s => matrix.Value(f, s)).Distinct().Order().ToArray();
            for (int t = 0; t < measured.Length; t++)
            {
                float threshold = t + 1 < measured.Length ? (measured[t] + measured[t + 1]) / 2 : float.PositiveInfinity;
                for (int routing = 0; routing < 4; routing++)
                {
                    var left = new double[classCount];
                    var right = new double[classCount];
                    for (int s = 0; s < matrix.SampleCount; s++)
                    {
                        var state = matrix.State(f, s);
                        bool goesLeft = state switch
                        {
                            CellState.Missing => (routing & 1) != 0,
                            CellState.BelowDetection => (routing & 2) != 0,
                            _ => matrix.Value(f, s) <= threshold,
                        };
                        (goesLeft ? left : right)[classes[s]] += weights[s];
                    }
                    double wl = left.Sum(), wr = right.Sum();
                    if (wl <= 0 || wr <= 0) continue;
                    double score = left.Sum(x => x * x) / wl + right.Sum(x => x * x) / wr;
                    best = Math.Max(best, score);
                }
            }
        }
        return best;
    }

    [Theory]
    [InlineData(1UL, 2, 0.0)]
    [InlineData(2UL, 2, 0.15)]
    [InlineData(3UL, 3, 0.0)]
    [InlineData(4UL, 3, 0.2)]
    [InlineData(5UL, 2, 0.3)]
    [InlineData(6UL, 4, 0.1)]
    public void Root_split_with_every_feature_tried_is_the_brute_force_best(ulong seed, int classCount, double unmeasured)
    {
        var (matrix, classes) = RandomData(seed, sampleCount: 40, featureCount: 5, classCount, levels: 6, unmeasured);
        var binned = new BinMapper().Bin(matrix);
        var generator = new Xoshiro256StarStar(seed);
        var weights = new double[classes.Length];
        for (int s = 0; s < weights.Length; s++) weights[s] = 1 + generator.NextInt(3); // like bootstrap counts
        var rows = Enumerable.Range(0, classes.Length).ToArray();
        var builder = new TreeBuilder(rows.Length, binned.FeatureCount, binned.MaxCodeCount, classCount);
        var options = new TreeOptions { FeaturesPerSplit = binned.FeatureCount, MaxDepth = 1 };
        var tree = builder.Grow(binned, rows, classes, weights, options, ref generator);

        Assert.False(tree.IsLeaf(0));
        double best = ReferenceSplitFinder.BestScore(binned, rows, classes, weights, classCount, minLeafSize: 1);
        int feature = tree.Features[0];
        double chosen = ReferenceSplitFinder.Score(binned.Codes(feature), binned.Bins(feature), tree.BinThresholds[0],
            tree.Routing[0], rows, classes, weights, classCount, minLeafSize: 1);
        // Ties are allowed: the chosen split must reach the best score, whichever tied split it is.
        Assert.Equal(best, chosen, 12);
        // Exact bins: the same best score as thresholds between sorted raw values (CART; Breiman et al. 1984).
        Assert.Equal(BestScoreFromSortedRawValues(matrix, classes, weights, classCount), best, 12);

        // Stored decrease = (S_L/W_L + S_R/W_R - S/W) / W_root, the Gini identity of GiniImpurity.
        var rootWeights = tree.ClassWeights[..classCount].ToArray();
        double total = rootWeights.Sum();
        double expectedDecrease = (best - rootWeights.Sum(w => w * w) / total) / total;
        Assert.Equal(expectedDecrease, tree.ImpurityDecreases[0], 12);

        // The children hold exactly the rows the split sends each way.
        int left = tree.LeftChildren[0], right = tree.RightChildren[0];
        int expectedLeft = rows.Count(s => tree.GoesLeft(0, binned.Codes(feature)[s]));
        Assert.Equal(expectedLeft, tree.NodeSampleCounts[left]);
        Assert.Equal(rows.Length - expectedLeft, tree.NodeSampleCounts[right]);
    }

    [Fact]
    public void Minimum_leaf_size_is_respected_by_the_chosen_split()
    {
        var (binned, classes, rows, weights, tree) = GrowUnweighted(11, 60, 4, 2, 10, 0.1, new TreeOptions { FeaturesPerSplit = 4, MinLeafSize = 7 });
        for (int node = 0; node < tree.NodeCount; node++)
            if (tree.IsLeaf(node)) Assert.True(tree.NodeSampleCounts[node] >= 7);
        double best = ReferenceSplitFinder.BestScore(binned, rows, classes, weights, 2, minLeafSize: 7);
        int feature = tree.Features[0];
        Assert.Equal(best, ReferenceSplitFinder.Score(binned.Codes(feature), binned.Bins(feature), tree.BinThresholds[0],
            tree.Routing[0], rows, classes, weights, 2, 7), 12);
    }

    [Fact]
    public void Leaves_are_pure_when_grown_without_limits()
    {
        var tree = GrowUnweighted(12, 80, 6, 3, 40, 0.05, new TreeOptions { FeaturesPerSplit = 2 }).Tree;
        int impure = 0;
        for (int node = 0; node < tree.NodeCount; node++)
        {
            if (!tree.IsLeaf(node)) continue;
            var w = tree.ClassWeights.Slice(node * 3, 3);
            if ((w[0] > 0 ? 1 : 0) + (w[1] > 0 ? 1 : 0) + (w[2] > 0 ? 1 : 0) > 1) impure++;
        }
        // A leaf can stay impure only when its samples share every code (indistinguishable rows).
        Assert.True(impure <= 1, $"{impure} impure leaves");
    }

    [Fact]
    public void Depth_limit_stops_growth()
    {
        var tree = GrowUnweighted(13, 100, 5, 2, 30, 0, new TreeOptions { MaxDepth = 2 }).Tree;
        Assert.True(tree.NodeCount <= 7);
    }

    [Fact]
    public void Splits_below_the_minimum_impurity_decrease_are_not_made()
    {
        var unlimited = GrowUnweighted(14, 120, 5, 2, 30, 0, new TreeOptions()).Tree;
        double threshold = unlimited.ImpurityDecreases.ToArray().Where(d => d > 0).Order().ElementAt(unlimited.SplitCount / 2);
        var limited = GrowUnweighted(14, 120, 5, 2, 30, 0, new TreeOptions { MinImpurityDecrease = threshold }).Tree;
        Assert.True(limited.SplitCount < unlimited.SplitCount);
        for (int node = 0; node < limited.NodeCount; node++)
            if (!limited.IsLeaf(node)) Assert.True(limited.ImpurityDecreases[node] >= threshold - 1e-12);
    }

    /// <summary>Grows one tree on all rows of random data with unit weights.</summary>
    private static (BinnedMatrix Binned, int[] Classes, int[] Rows, double[] Weights, DecisionTree Tree) GrowUnweighted(
        ulong seed, int sampleCount, int featureCount, int classCount, int levels, double unmeasured, TreeOptions options)
    {
        var (matrix, classes) = RandomData(seed, sampleCount, featureCount, classCount, levels, unmeasured);
        var binned = new BinMapper().Bin(matrix);
        var rows = Enumerable.Range(0, classes.Length).ToArray();
        var weights = Enumerable.Repeat(1.0, rows.Length).ToArray();
        var generator = new Xoshiro256StarStar(seed);
        var builder = new TreeBuilder(rows.Length, binned.FeatureCount, binned.MaxCodeCount, classCount);
        return (binned, classes, rows, weights, builder.Grow(binned, rows, classes, weights, options, ref generator));
    }
}
