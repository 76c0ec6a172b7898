using System.Text.Json;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Engine.Panels;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Survival;

/// <summary>
/// Survival trees split on the log-rank statistic and hold Nelson-Aalen hazards (Ishwaran et al.
/// 2008), checked against ranger (reference/survival/make_survival_forest_reference.R) and against
/// hand-worked examples.
/// </summary>
public class SurvivalTreeTests
{
    private static readonly SamplingOptions AllRows = new() { Drawing = SampleDrawing.Subsample, SubsampleFraction = 1.0 };

    [Fact]
    public void Root_split_on_every_marker_matches_ranger()
    {
        // ranger(Surv(time, status) ~ ., num.trees = 1, mtry = 20, replace = FALSE, sample.fraction = 1,
        // max.depth = 1, splitrule = "logrank"): treeInfo's root marker and mid-point threshold.
        var (matrix, followUp) = SurvivalForestData.Load();
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "survival", "survival_forest_reference.json")));
        var root = json.RootElement.GetProperty("root_split");
        var forest = SurvivalForestTrainer.Train(new BinMapper().Bin(matrix), followUp, new ForestOptions
        {
            TreeCount = 1,
            Sampling = AllRows,
            Tree = new TreeOptions { MaxDepth = 1, FeaturesPerSplit = matrix.FeatureCount },
        });
        var tree = forest.Tree(0);
        Assert.Equal(root.GetProperty("marker").GetString(), matrix.FeatureNames[tree.Topology.Features[0]]);
        Assert.Equal(root.GetProperty("threshold").GetDouble(), tree.Topology.Thresholds[0], 1e-4);
    }

    [Fact]
    public void Split_statistic_and_leaf_hazards_follow_the_worked_example()
    {
        // Hand-worked example of the two-sample log-rank statistic (Mantel 1966; the formula in the
        // builder's remarks; numbers ours): marker 1, 2, 3, 4;
        // times 2, 3, 5, 8; all events. The cut x <= 2 gives left {t=2, t=3}, right {t=5, t=8}.
        // Event times 2, 3, 5, 8 with Y = 4, 3, 2, 1 at risk and d = 1 each; left at risk 2, 1, 0, 0.
        // Observed - expected in the left group: (1 - 2/4) + (1 - 1/3) + (0 - 0) + (0 - 0) = 7/6.
        // Variance: (2/4)(2/4)(3/3)·1 + (1/3)(2/3)(2/2)·1 + 0 + 0 = 1/4 + 2/9 = 17/36.
        // Statistic 7/6 / sqrt(17/36) = 7/sqrt(17) = 1.6977. The cut x <= 1 gives 0.75/sqrt(0.1875)
        // = 1.7321, larger: left {t=2}: O - E = 1 - 1/4, V = (1/4)(3/4)(3/3) = 3/16. x <= 3: left
        // {2, 3, 5}: O - E = 1/4 + 1/3 + 1/2 = 13/12, V = 3/16 + 2/9 + 1/4 = 95/144, statistic
        // 1.334. So the root cuts at x <= 1 (threshold 1.5) with statistic sqrt(3) = 1.7321.
        var builder = new FeatureMatrixBuilder(["x"], ["a", "b", "c", "d"]);
        float[] values = [1, 2, 3, 4];
        for (int s = 0; s < values.Length; s++) builder.SetMeasured(0, s, values[s]);
        var matrix = builder.Build();
        var followUp = new FollowUpTimes([2.0, 3, 5, 8], [true, true, true, true]);
        var forest = SurvivalForestTrainer.Train(new BinMapper().Bin(matrix), followUp, new ForestOptions
        {
            TreeCount = 1,
            Sampling = AllRows,
            Tree = new TreeOptions { MaxDepth = 1 },
        });
        var tree = forest.Tree(0);
        Assert.Equal(1.5f, tree.Topology.Thresholds[0]);
        Assert.Equal(Math.Sqrt(3), tree.SplitStatistics[0], 12);
        // Right leaf {t=3, 5, 8}: Nelson-Aalen steps 1/3, 1/3 + 1/2, 1/3 + 1/2 + 1 at event times 3, 5, 8
        // (indices 1, 2, 3 of the training event times 2, 3, 5, 8), 0 before.
        int right = tree.Topology.RightChildren[0];
        Assert.Equal(0.0, tree.CumulativeHazard(right, 0), 12);
        Assert.Equal(1.0 / 3, tree.CumulativeHazard(right, 1), 12);
        Assert.Equal(1.0 / 3 + 0.5, tree.CumulativeHazard(right, 2), 12);
        Assert.Equal(1.0 / 3 + 0.5 + 1, tree.CumulativeHazard(right, 3), 12);
        // Mortality (Ishwaran et al. 2008): the hazard summed over the four event times.
        Assert.Equal(0 + 1.0 / 3 + (1.0 / 3 + 0.5) + (1.0 / 3 + 0.5 + 1), tree.Mortality[right], 12);
        // Left leaf {t=2}: hazard 1 from time 2 on, mortality 4.
        Assert.Equal(4.0, tree.Mortality[tree.Topology.LeftChildren[0]], 12);
    }

    [Fact]
    public void Forest_is_identical_on_any_thread_count()
    {
        // Common practice of this project: every draw derives from (seed, repeat, tree).
        var (matrix, followUp) = SurvivalForestData.Load();
        var binned = new BinMapper().Bin(matrix);
        double[] Grow(int threads) =>
            SurvivalForestTrainer.Train(binned, followUp, new ForestOptions { TreeCount = 40, Seed = 4, ThreadCount = threads }).OutOfBagRisk();
        var one = Grow(1);
        Assert.Equal(one, Grow(2));
        Assert.Equal(one, Grow(4));
    }
}
