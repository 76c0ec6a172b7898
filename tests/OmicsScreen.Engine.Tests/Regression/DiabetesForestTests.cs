using System.Text.Json;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Regression;
using OmicsScreen.TestSupport;
using Xunit.Abstractions;

namespace OmicsScreen.Engine.Tests.Regression;

/// <summary>
/// Regression forests on public data: the diabetes progression data of Efron et al. (2004, Ann.
/// Statist. 32:407-499; 442 patients, 10 baseline measurements) as shipped with scikit-learn,
/// against scikit-learn's RandomForestRegressor (reference/regression/make_diabetes_reference.py
/// wrote diabetes.csv and diabetes_reference.json; 500 trees, 3 features per split, leaves to
/// purity, bootstrap, seeds 1..10, the same settings as ours here).
/// </summary>
public class DiabetesForestTests(ITestOutputHelper output)
{
    private const int Seeds = 10;

    [Fact]
    public void Out_of_bag_r_squared_is_within_0_02_of_scikit_learn_and_impurity_ranking_agrees()
    {
        var (matrix, y) = ReferenceTables.Measured("regression", "diabetes.csv");
        var binned = new BinMapper().Bin(matrix);
        var ours = new double[Seeds];
        var importance = new double[matrix.FeatureCount];
        for (int seed = 0; seed < Seeds; seed++)
        {
            var forest = RegressionForestTrainer.Train(binned, y, new ForestOptions { TreeCount = 500, Seed = (ulong)(seed + 1) });
            ours[seed] = new RegressionOutOfBag(forest, y).RSquared;
            var decrease = forest.MeanImpurityDecrease();
            for (int f = 0; f < importance.Length; f++) importance[f] += decrease[f] / Seeds;
        }
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "regression", "diabetes_reference.json")));
        var forestReference = json.RootElement.GetProperty("forest");
        var theirs = forestReference.GetProperty("oob_r_squared").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        output.WriteLine($"OOB R^2 ours {ours.Average():F4} (SD {StandardDeviation(ours):F4}), scikit-learn {theirs.Average():F4} (SD {StandardDeviation(theirs):F4})");
        // Issue 17's goal: the mean over seeds within 0.02 of scikit-learn's.
        Assert.InRange(ours.Average(), theirs.Average() - 0.02, theirs.Average() + 0.02);

        // Issue 17's goal: impurity importance ranks the features as scikit-learn's
        // feature_importances_ (mean over the same seeds) with Spearman's rho >= 0.9. Only the
        // ranking is compared: scikit-learn normalises its importances to sum to one.
        var reference = new double[importance.Length];
        foreach (var run in forestReference.GetProperty("feature_importances").EnumerateArray())
        {
            int f = 0;
            foreach (var value in run.EnumerateArray()) reference[f++] += value.GetDouble() / Seeds;
        }
        double rho = RankCorrelation(importance, reference);
        output.WriteLine("ours: " + string.Join(" ", importance.Select(v => v.ToString("G4"))));
        output.WriteLine("scikit-learn: " + string.Join(" ", reference.Select(v => v.ToString("G4"))) + $"; Spearman {rho:F3}");
        Assert.True(rho >= 0.9, $"Spearman's rho of the two importance rankings is {rho:F3}.");
    }

    /// <summary>Spearman's rho of two vectors without ties: Pearson's correlation of their ranks (common practice).</summary>
    private static double RankCorrelation(double[] a, double[] b)
    {
        double[] Ranks(double[] v)
        {
            var order = Enumerable.Range(0, v.Length).OrderBy(i => v[i]).ToArray();
            var ranks = new double[v.Length];
            for (int r = 0; r < order.Length; r++) ranks[order[r]] = r + 1;
            return ranks;
        }
        var (x, y) = (Ranks(a), Ranks(b));
        double mx = x.Average(), my = y.Average();
        double sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++) { sxy += (x[i] - mx) * (y[i] - my); sxx += (x[i] - mx) * (x[i] - mx); syy += (y[i] - my) * (y[i] - my); }
        return sxy / Math.Sqrt(sxx * syy);
    }

    private static double StandardDeviation(double[] values)
    {
        double mean = values.Average();
        return Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1));
    }
}
