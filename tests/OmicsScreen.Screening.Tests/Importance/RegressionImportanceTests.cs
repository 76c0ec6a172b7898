using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Screening.Importance;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Importance;

/// <summary>
/// Importances of a measured outcome on Friedman's first benchmark (Friedman 1991; committed in
/// reference/regression), where the generating formula says which features matter: x1..x5 enter
/// the outcome, x6..x30 are independent noise.
/// </summary>
public class RegressionImportanceTests
{
    [Fact]
    public void Both_importances_put_the_five_formula_features_first()
    {
        // Friedman (1991): y = 10 sin(pi x1 x2) + 20 (x3 - 0.5)^2 + 10 x4 + 5 x5 + noise.
        var (matrix, y) = Friedman1Data.Load();
        var binned = new BinMapper().Bin(matrix);
        var options = new ForestOptions { TreeCount = 300, Seed = 5 };
        var corrected = RegressionImportance.MeasureCorrected(binned, y, null, [], options);
        var forest = RegressionForestTrainer.Train(binned, y, options);
        var permutation = RegressionImportance.MeasurePermutation(forest, binned, y);
        foreach (var scores in new[] { corrected.Features, permutation.MeanRise })
        {
            var top = Enumerable.Range(0, scores.Length).OrderByDescending(f => scores[f]).Take(Friedman1Data.InformativeCount);
            Assert.Equal(Enumerable.Range(0, Friedman1Data.InformativeCount), top.Order());
        }
    }

    [Fact]
    public void Corrected_importance_of_noise_features_and_decoys_centres_on_zero()
    {
        // Nembrini et al. (2018): AIR of a feature unrelated to the outcome has expectation 0, as does a
        // decoy's (a once-permuted copy scored against its source's permuted copy). Checked on the 25
        // noise features and 25 decoys: their mean lies within 3 standard errors of 0, while the five
        // formula features' AIR are far above it.
        var (matrix, y) = Friedman1Data.Load();
        var binned = new BinMapper().Bin(matrix);
        int[] decoySources = Enumerable.Range(5, 25).ToArray();
        var corrected = RegressionImportance.MeasureCorrected(binned, y, null, decoySources, new ForestOptions { TreeCount = 300, Seed = 8 });
        foreach (var values in new[] { corrected.Features[5..], corrected.Decoys })
        {
            double mean = values.Average();
            double se = Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1) / values.Length);
            Assert.InRange(mean, -3 * se, 3 * se);
            Assert.True(corrected.Features[..5].Min() > values.Max());
        }
    }

    [Fact]
    public void Permutation_importance_is_identical_on_any_thread_count_and_zero_for_unused_features()
    {
        // Common practice of this project: every permutation derives from (seed, repeat, tree, feature).
        var (matrix, y) = Friedman1Data.Load();
        var binned = new BinMapper().Bin(matrix);
        var forest = RegressionForestTrainer.Train(binned, y, new ForestOptions { TreeCount = 40, Seed = 2, Tree = new() { MaxDepth = 2 } });
        var one = RegressionImportance.MeasurePermutation(forest, binned, y, threadCount: 1);
        var two = RegressionImportance.MeasurePermutation(forest, binned, y, threadCount: 2);
        Assert.Equal(one.MeanRise, two.MeanRise);
        Assert.Equal(one.StandardError, two.StandardError);
        var used = new HashSet<int>();
        for (int t = 0; t < forest.TreeCount; t++)
            foreach (int f in forest.Tree(t).Topology.Features) if (f >= 0) used.Add(f);
        for (int f = 0; f < matrix.FeatureCount; f++)
            if (!used.Contains(f)) Assert.Equal(0.0, one.MeanRise[f]);
    }
}
