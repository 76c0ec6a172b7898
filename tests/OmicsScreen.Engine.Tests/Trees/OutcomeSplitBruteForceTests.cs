using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Tests.Trees;

/// <summary>
/// The root split of a regression tree and of a survival tree, grown on every row once with every
/// feature tried, against a brute-force search over every threshold between sorted distinct raw
/// values (issues 17 and 18). Criteria written out from their definitions: the decrease in the sum
/// of squared errors (CART; Breiman et al. 1984, ch. 8) and the standardised two-sample log-rank
/// statistic |sum_t (d_Lt - Y_Lt d_t / Y_t)| / sqrt(sum_t Y_Lt/Y_t (1 - Y_Lt/Y_t) (Y_t - d_t)/(Y_t - 1) d_t)
/// (Mantel 1966; the split rule of Ishwaran et al. 2008 and of ranger's "logrank").
/// </summary>
public class OutcomeSplitBruteForceTests
{
    private static readonly ForestOptions OneExactTree = new()
    {
        TreeCount = 1,
        Seed = 1,
        Sampling = new SamplingOptions { Drawing = SampleDrawing.Subsample, SubsampleFraction = 1.0 },
        Tree = new TreeOptions { MaxDepth = 1, FeaturesPerSplit = 4 },
    };

    /// <summary>30 samples x 4 features with values on a coarse grid, so thresholds and features tie often.</summary>
    private static FeatureMatrix Features(ulong seed, int sampleCount = 30, int featureCount = 4, int levels = 8)
    {
        var generator = new Xoshiro256StarStar(seed);
        var builder = new FeatureMatrixBuilder(
            Enumerable.Range(0, featureCount).Select(i => $"f{i}").ToArray(),
            Enumerable.Range(0, sampleCount).Select(i => $"s{i}").ToArray());
        for (int f = 0; f < featureCount; f++)
            for (int s = 0; s < sampleCount; s++) builder.SetMeasured(f, s, generator.NextInt(levels) * 0.25f);
        return builder.Build();
    }

    /// <summary>Every partition "value at or below a cut" over sorted distinct values of every feature.</summary>
    private static IEnumerable<bool[]> AllPartitions(FeatureMatrix matrix)
    {
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            var values = Enumerable.Range(0, matrix.SampleCount).Select(s => matrix.Value(f, s)).ToArray();
            var distinct = values.Distinct().Order().ToArray();
            for (int c = 0; c + 1 < distinct.Length; c++)
                yield return values.Select(v => v <= distinct[c]).ToArray();
        }
    }

    private static bool[] RootPartition(SplitTopology topology, FeatureMatrix matrix)
    {
        Assert.False(topology.IsLeaf(0));
        int left = topology.LeftChildren[0];
        return Enumerable.Range(0, matrix.SampleCount).Select(s => topology.LeafOf(matrix, s) == left).ToArray();
    }

    private static double SquaredErrorDecrease(bool[] left, double[] y)
    {
        double sum = y.Sum(), sumLeft = 0;
        int n = y.Length, nLeft = 0;
        for (int s = 0; s < n; s++) if (left[s]) { sumLeft += y[s]; nLeft++; }
        if (nLeft == 0 || nLeft == n) return double.NegativeInfinity;
        double sumRight = sum - sumLeft;
        return sumLeft * sumLeft / nLeft + sumRight * sumRight / (n - nLeft) - sum * sum / n;
    }

    private static double StandardisedLogRank(bool[] left, double[] time, bool[] died)
    {
        if (left.All(l => l) || left.All(l => !l)) return double.NegativeInfinity;
        double numerator = 0, variance = 0;
        foreach (double t in time.Where((_, s) => died[s]).Distinct())
        {
            double atRisk = 0, atRiskLeft = 0, deaths = 0, deathsLeft = 0;
            for (int s = 0; s < time.Length; s++)
            {
                if (time[s] < t) continue;
                atRisk++;
                if (left[s]) atRiskLeft++;
                if (time[s] == t && died[s]) { deaths++; if (left[s]) deathsLeft++; }
            }
            numerator += deathsLeft - atRiskLeft * deaths / atRisk;
            if (atRisk > 1) variance += atRiskLeft / atRisk * (1 - atRiskLeft / atRisk) * (atRisk - deaths) / (atRisk - 1) * deaths;
        }
        return variance > 0 ? Math.Abs(numerator) / Math.Sqrt(variance) : double.NegativeInfinity;
    }

    [Theory]
    [InlineData(1UL)]
    [InlineData(2UL)]
    [InlineData(3UL)]
    [InlineData(4UL)]
    [InlineData(5UL)]
    public void Regression_root_split_reaches_the_brute_force_best_decrease(ulong seed)
    {
        var matrix = Features(seed);
        var generator = new Xoshiro256StarStar(seed + 100);
        // The outcome leans on f1 so that the best split is not noise alone; ties in y too.
        var y = Enumerable.Range(0, matrix.SampleCount)
            .Select(s => Math.Round(matrix.Value(1, s) + generator.NextGaussian(), 1)).ToArray();
        var forest = RegressionForestTrainer.Train(new BinMapper().Bin(matrix), y, OneExactTree);
        double best = AllPartitions(matrix).Max(p => SquaredErrorDecrease(p, y));
        double chosen = SquaredErrorDecrease(RootPartition(forest.Tree(0).Topology, matrix), y);
        // Ties are allowed: the chosen split must reach the best decrease, whichever tied split it is.
        Assert.Equal(best, chosen, 9);
    }

    [Theory]
    [InlineData(1UL)]
    [InlineData(2UL)]
    [InlineData(3UL)]
    [InlineData(4UL)]
    [InlineData(5UL)]
    public void Survival_root_split_reaches_the_brute_force_best_log_rank_statistic(ulong seed)
    {
        var matrix = Features(seed);
        var generator = new Xoshiro256StarStar(seed + 200);
        var time = new double[matrix.SampleCount];
        var died = new bool[matrix.SampleCount];
        for (int s = 0; s < time.Length; s++)
        {
            // Exponential event times with hazard rising with f2, uniform censoring; whole units, so times tie.
            double eventTime = -Math.Log(1 - generator.NextDouble()) / (0.1 * Math.Exp(0.8 * matrix.Value(2, s)));
            double censorTime = 2 + 20 * generator.NextDouble();
            time[s] = Math.Ceiling(Math.Min(eventTime, censorTime));
            died[s] = eventTime <= censorTime;
        }
        var forest = SurvivalForestTrainer.Train(new BinMapper().Bin(matrix), new FollowUpTimes(time, died), OneExactTree);
        double best = AllPartitions(matrix).Max(p => StandardisedLogRank(p, time, died));
        double chosen = StandardisedLogRank(RootPartition(forest.Tree(0).Topology, matrix), time, died);
        Assert.Equal(best, chosen, 9);
    }
}
