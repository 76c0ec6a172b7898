using System.Text.Json;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// `grow` on a measured and on a time-to-event outcome, through the CLI, against general-purpose
/// forest libraries on the committed reference data: Friedman's first benchmark
/// (reference/regression, scikit-learn's RandomForestRegressor and ranger, seeds 1..10) and the
/// invented survival panel of reference/survival (ranger's random survival forest, seeds 1..10).
/// Same settings as theirs: 500 trees, floor(sqrt(p)) features per split, leaves of one sample, bootstrap.
/// </summary>
public sealed class GrowOutcomeKindTests : IDisposable
{
    private const int Seeds = 10;
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static string Reference(string folder, string file) => Path.Combine(ReferenceData.Directory, folder, file);

    private static JsonDocument Grow(params string[] args)
    {
        var run = CliHarness.Run(["grow", .. args, "--min-leaf", "1", "--threads", "2", "--json"]);
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        return JsonDocument.Parse(run.Out);
    }

    private static double[] Values(JsonElement element) => element.EnumerateArray().Select(v => v.GetDouble()).ToArray();

    private static double StandardDeviation(double[] values)
    {
        double mean = values.Average();
        return Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1));
    }

    [Fact]
    public void A_regression_forest_matches_scikit_learn_and_ranger_out_of_bag_error_and_finds_the_five_true_features()
    {
        string panel = Reference("regression", "friedman1.csv");
        var mse = new double[Seeds];
        var y = File.ReadAllLines(panel).Skip(1).Select(l => double.Parse(l.Split(',')[1], System.Globalization.CultureInfo.InvariantCulture)).ToArray();
        double variance = y.Sum(v => (v - y.Average()) * (v - y.Average())) / y.Length;
        for (int seed = 1; seed <= Seeds; seed++)
        {
            using var json = Grow(panel, "--outcome", "y", "--seed", seed.ToString(System.Globalization.CultureInfo.InvariantCulture));
            var outOfBag = json.RootElement.GetProperty("out_of_bag");
            mse[seed - 1] = outOfBag.GetProperty("mean_squared_error").GetDouble();
            // R² = 1 - MSE / variance (divisor n) over the samples predicted; with 500 trees every sample is.
            Assert.Equal(1 - mse[seed - 1] / variance, outOfBag.GetProperty("r_squared").GetDouble(), 9);
            var curve = Values(outOfBag.GetProperty("mean_squared_error_curve"));
            Assert.Equal(500, curve.Length);
            Assert.Equal(mse[seed - 1], curve[^1], 12);
            if (seed == 1)
            {
                // Known truth of the benchmark (Friedman 1991): only x1..x5 enter y; they lead both importances.
                var importance = json.RootElement.GetProperty("importance").EnumerateArray().ToList();
                Assert.Equal(["x1", "x2", "x3", "x4", "x5"], importance.Take(5).Select(e => e.GetProperty("feature").GetString()).Order());
                var byPermutation = importance.OrderByDescending(e => e.GetProperty("permutation_mse_rise").GetDouble()).Take(5);
                Assert.Equal(["x1", "x2", "x3", "x4", "x5"], byPermutation.Select(e => e.GetProperty("feature").GetString()).Order());
            }
        }
        using var reference = JsonDocument.Parse(File.ReadAllText(Reference("regression", "regression_reference.json")));
        var forest = reference.RootElement.GetProperty("forest");
        var means = new List<double>();
        double spread = 0;
        foreach (string library in new[] { "scikit-learn", "ranger" })
        {
            var values = Values(forest.GetProperty(library).GetProperty("oob_mse"));
            means.Add(values.Average());
            spread = Math.Max(spread, StandardDeviation(values));
        }
        // As the engine's own test (RegressionForestTests): within three standard errors of a
        // difference of two 10-seed means of the range the two libraries span.
        double tolerance = 3 * spread * Math.Sqrt(2.0 / Seeds);
        Assert.InRange(mse.Average(), means.Min() - tolerance, means.Max() + tolerance);
    }

    [Fact]
    public void A_survival_forest_matches_rangers_out_of_bag_concordance_and_finds_the_true_markers()
    {
        string panel = Reference("survival", "survival_forest.csv");
        var concordance = new double[Seeds];
        for (int seed = 1; seed <= Seeds; seed++)
        {
            using var json = Grow(panel, "--follow-up", "time", "--event", "status", "--seed", seed.ToString(System.Globalization.CultureInfo.InvariantCulture));
            var outOfBag = json.RootElement.GetProperty("out_of_bag");
            concordance[seed - 1] = outOfBag.GetProperty("concordance").GetDouble();
            Assert.Equal(1 - concordance[seed - 1], outOfBag.GetProperty("error").GetDouble(), 12);
            Assert.InRange(concordance[seed - 1], outOfBag.GetProperty("concordance_low95").GetDouble(), outOfBag.GetProperty("concordance_high95").GetDouble());
            var curve = Values(outOfBag.GetProperty("concordance_curve"));
            Assert.Equal(concordance[seed - 1], curve[^1], 12);
            if (seed == 1)
            {
                // By construction (make_survival_forest_reference.R) x1 and x2 enter the hazard linearly
                // and most strongly; they lead the out-of-bag permutation importance.
                var byPermutation = json.RootElement.GetProperty("importance").EnumerateArray()
                    .OrderByDescending(e => e.GetProperty("permutation_concordance_drop").GetDouble()).Take(2);
                Assert.Equal(["x1", "x2"], byPermutation.Select(e => e.GetProperty("feature").GetString()).Order());
            }
        }
        using var reference = JsonDocument.Parse(File.ReadAllText(Reference("survival", "survival_forest_reference.json")));
        var ranger = Values(reference.RootElement.GetProperty("forest").GetProperty("oob_concordance_survival_convention"));
        // As the engine's own test (SurvivalImportanceTests): three standard errors of a difference of
        // two 10-seed means, at least 0.01 (ranger and we may break ties in the split search differently).
        double tolerance = Math.Max(0.01, 3 * Math.Max(StandardDeviation(ranger), StandardDeviation(concordance)) * Math.Sqrt(2.0 / Seeds));
        Assert.InRange(concordance.Average(), ranger.Average() - tolerance, ranger.Average() + tolerance);
    }

    [Theory]
    [InlineData("measured")]
    [InlineData("time")]
    public void One_and_two_threads_give_the_same_forest(string kind)
    {
        string panel = kind == "time" ? Reference("survival", "survival_forest.csv") : Reference("regression", "friedman1.csv");
        string[] outcome = kind == "time" ? ["--follow-up", "time", "--event", "status"] : ["--outcome", "y"];
        string one = Path.Combine(_folder.Path, "one.tsv"), two = Path.Combine(_folder.Path, "two.tsv");
        var first = CliHarness.Run(["grow", panel, .. outcome, "--trees", "100", "--threads", "1", "--importance-out", one]);
        var second = CliHarness.Run(["grow", panel, .. outcome, "--trees", "100", "--threads", "2", "--importance-out", two]);
        Assert.True(first.ExitCode == ExitCode.Success, first.Error);
        Assert.True(second.ExitCode == ExitCode.Success, second.Error);
        Assert.Equal(File.ReadAllBytes(one), File.ReadAllBytes(two));
        // The printed summary is the same but for the timings.
        static string WithoutTimes(string text) => string.Join('\n', text.Split('\n').Where(l => !l.Contains(" time ", StringComparison.Ordinal)));
        Assert.Equal(WithoutTimes(first.Out), WithoutTimes(second.Out));
    }
}
