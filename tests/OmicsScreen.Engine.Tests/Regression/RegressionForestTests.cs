using System.Text.Json;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;
using OmicsScreen.TestSupport;
using Xunit.Abstractions;

namespace OmicsScreen.Engine.Tests.Regression;

/// <summary>
/// Regression trees and forests against scikit-learn and ranger (reference/regression: Friedman's
/// first benchmark, Friedman 1991, drawn by scikit-learn's make_friedman1 and committed as CSV with
/// the script make_regression_reference.py that computed every reference value), and against
/// worked examples of the squared-error decrease (CART; Breiman et al. 1984, ch. 8).
/// </summary>
public class RegressionForestTests(ITestOutputHelper output)
{
    /// <summary>Every row once with weight 1 (or its sample weight): a plain CART tree, no sampling.</summary>
    private static readonly SamplingOptions AllRows = new() { Drawing = SampleDrawing.Subsample, SubsampleFraction = 1.0 };

    [Fact]
    public void Depth_three_tree_on_all_features_matches_scikit_learn()
    {
        // Reference: DecisionTreeRegressor(max_depth=3) on the same 300 x 30 values (float32 in both:
        // scikit-learn's trees cast X to float32). Training predictions and unnormalised importances.
        var (matrix, y) = Friedman1();
        using var json = Reference();
        var tree = json.RootElement.GetProperty("tree");
        var binned = new BinMapper().Bin(matrix);
        var forest = RegressionForestTrainer.Train(binned, y, new ForestOptions
        {
            TreeCount = 1,
            Sampling = AllRows,
            Tree = new TreeOptions { MaxDepth = 3, FeaturesPerSplit = matrix.FeatureCount },
        });
        Assert.Equal(tree.GetProperty("node_count").GetInt32(), forest.Tree(0).Topology.NodeCount);
        var expected = tree.GetProperty("train_predictions").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var predicted = forest.Predict(binned);
        for (int s = 0; s < expected.Length; s++) Assert.Equal(expected[s], predicted[s], 1e-8);
        // The raw-value path (thresholds in original units) agrees with the binned one on training rows.
        Assert.Equal(predicted, forest.Predict(matrix));
        var decrease = tree.GetProperty("impurity_decrease").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var ours = forest.MeanImpurityDecrease();
        for (int f = 0; f < decrease.Length; f++) Assert.Equal(decrease[f], ours[f], 1e-8);
    }

    [Fact]
    public void Out_of_bag_error_over_seeds_matches_scikit_learn_and_ranger()
    {
        // Reference: out-of-bag MSE of RandomForestRegressor and ranger, 500 trees, floor(sqrt(30)) = 5
        // features per split, leaves to purity, bootstrap, seeds 1..10 (same settings as ours here).
        const int seeds = 10;
        var (matrix, y) = Friedman1();
        var binned = new BinMapper().Bin(matrix);
        var ours = new double[seeds];
        for (int seed = 0; seed < seeds; seed++)
        {
            var forest = RegressionForestTrainer.Train(binned, y, new ForestOptions { TreeCount = 500, Seed = (ulong)(seed + 1) });
            ours[seed] = new RegressionOutOfBag(forest, y).MeanSquaredError;
        }
        using var json = Reference();
        var forestReference = json.RootElement.GetProperty("forest");
        var means = new List<double>();
        double spread = 0;
        foreach (string library in new[] { "scikit-learn", "ranger" })
        {
            var values = forestReference.GetProperty(library).GetProperty("oob_mse").EnumerateArray().Select(v => v.GetDouble()).ToArray();
            means.Add(values.Average());
            spread = Math.Max(spread, StandardDeviation(values));
            output.WriteLine($"{library}: mean {values.Average():F4}, SD {StandardDeviation(values):F4}");
        }
        // As for class forests (ReferenceLibraryErrorTests): within three standard errors of a
        // difference of two 10-seed means of the range the two libraries span.
        double tolerance = 3 * spread * Math.Sqrt(2.0 / seeds);
        output.WriteLine($"ours: mean {ours.Average():F4}, SD {StandardDeviation(ours):F4}; tolerance {tolerance:F4}");
        Assert.InRange(ours.Average(), means.Min() - tolerance, means.Max() + tolerance);
    }

    [Fact]
    public void Forest_is_identical_on_any_thread_count()
    {
        // Common practice of this project (DEVELOPERS.md): every draw derives from (seed, repeat, tree).
        var (matrix, y) = Friedman1();
        var binned = new BinMapper().Bin(matrix);
        RegressionOutOfBag Grow(int threads) => new(RegressionForestTrainer.Train(binned, y,
            new ForestOptions { TreeCount = 60, Seed = 9, ThreadCount = threads }), y);
        var one = Grow(1);
        foreach (int threads in new[] { 2, 4 })
        {
            var other = Grow(threads);
            Assert.Equal(one.Predictions.ToArray(), other.Predictions.ToArray());
            Assert.Equal(one.ErrorCurve.ToArray(), other.ErrorCurve.ToArray());
        }
    }

    [Fact]
    public void Split_on_weighted_rows_follows_the_squared_error_decrease()
    {
        // Worked example (squared-error decrease S_L²/W_L + S_R²/W_R - S²/W, CART ch. 8), by hand:
        // x = 1, 2, 3, 4; y = 1, 2, 5, 5; weights 2, 1, 1, 1 (as a bootstrap drawing the first row twice).
        // W = 5, S = 14. Cuts: x <= 1: 2 + 48 - 39.2 = 10.8; x <= 2: 16/3 + 50 - 39.2 = 16.133;
        // x <= 3: 20.25 + 25 - 39.2 = 6.05. Best x <= 2, decrease 16.133/5 = 3.2267 per unit root
        // weight; children means (2·1 + 2)/3 = 4/3 and 5; threshold midway, 2.5.
        var matrix = Matrix([1f, 2f, 3f, 4f]);
        double[] y = [1, 2, 5, 5];
        var binned = new BinMapper().Bin(matrix);
        var forest = RegressionForestTrainer.Train(binned, y, new ForestOptions
        {
            TreeCount = 1,
            Sampling = AllRows,
            Tree = new TreeOptions { MaxDepth = 1 },
        }, sampleWeights: [2, 1, 1, 1]);
        var tree = forest.Tree(0);
        Assert.Equal(3, tree.Topology.NodeCount);
        Assert.Equal(2.5f, tree.Topology.Thresholds[0]);
        Assert.Equal(14.0 / 5, tree.NodeMeans[0], 12);
        Assert.Equal(4.0 / 3, tree.NodeMeans[tree.Topology.LeftChildren[0]], 12);
        Assert.Equal(5.0, tree.NodeMeans[tree.Topology.RightChildren[0]], 12);
        Assert.Equal((16.0 / 3 + 50 - 39.2) / 5, tree.ImpurityDecreases[0], 12);
    }

    [Fact]
    public void Missing_cells_go_to_the_side_their_outcomes_belong_to()
    {
        // Common practice (missing values routed to the better side, as in the class trees): the
        // samples without a value have the high outcome, so the best split is measured vs missing.
        var builder = new FeatureMatrixBuilder(["m"], ["a", "b", "c", "d", "e", "f"]);
        float[] values = [1, 2, 3, 4, float.NaN, float.NaN];
        for (int s = 0; s < values.Length; s++)
            if (float.IsNaN(values[s])) builder.SetMissing(0, s);
            else builder.SetMeasured(0, s, values[s]);
        var matrix = builder.Build();
        double[] y = [0, 0, 0, 0, 10, 10];
        var forest = RegressionForestTrainer.Train(new BinMapper().Bin(matrix), y, new ForestOptions
        {
            TreeCount = 1,
            Sampling = AllRows,
            Tree = new TreeOptions { MaxDepth = 1 },
        });
        var predicted = forest.Predict(matrix);
        Assert.Equal([0, 0, 0, 0, 10, 10], predicted);
    }

    [Fact]
    public void Out_of_bag_figures_follow_their_definitions()
    {
        // R² = 1 - MSE / variance (divisor n), the definition of scikit-learn's r2_score; the curve's
        // last point is the final MSE; every sample with an out-of-bag tree has a prediction.
        var (matrix, y) = Friedman1();
        var forest = RegressionForestTrainer.Train(new BinMapper().Bin(matrix), y, new ForestOptions { TreeCount = 100, Seed = 3 });
        var oob = new RegressionOutOfBag(forest, y);
        Assert.Equal(y.Length, oob.PredictedSampleCount);
        double mse = 0;
        for (int s = 0; s < y.Length; s++) mse += (y[s] - oob.Predictions[s]) * (y[s] - oob.Predictions[s]);
        mse /= y.Length;
        double mean = y.Average();
        double variance = y.Sum(v => (v - mean) * (v - mean)) / y.Length;
        Assert.Equal(mse, oob.MeanSquaredError, 9);
        Assert.Equal(1 - mse / variance, oob.RSquared, 9);
        Assert.Equal(oob.MeanSquaredError, oob.ErrorCurve[^1], 9);
        // More trees lower the error on this signal-rich panel (Breiman 2001, section 11).
        Assert.True(oob.ErrorCurve[^1] < oob.ErrorCurve[9]);
        Assert.InRange(oob.RSquared, 0.5, 1.0);
    }

    private static FeatureMatrix Matrix(float[] values)
    {
        var builder = new FeatureMatrixBuilder(["x"], values.Select((_, i) => "s" + i).ToArray());
        for (int s = 0; s < values.Length; s++) builder.SetMeasured(0, s, values[s]);
        return builder.Build();
    }

    private static JsonDocument Reference() =>
        JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "regression", "regression_reference.json")));

    private static (FeatureMatrix Matrix, double[] Y) Friedman1() => Friedman1Data.Load();

    private static double StandardDeviation(double[] values)
    {
        double mean = values.Average();
        return Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1));
    }
}
