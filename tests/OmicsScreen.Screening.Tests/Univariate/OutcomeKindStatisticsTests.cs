using System.Text.Json;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Univariate;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Univariate;

/// <summary>
/// Per-marker statistics of measured and time-to-event outcomes against scipy/statsmodels
/// (reference/regression, Friedman's first benchmark) and R's survival package
/// (reference/survival/survival_forest.csv), each from the committed script that made the values.
/// </summary>
public class OutcomeKindStatisticsTests
{
    [Fact]
    public void Spearman_rows_match_scipy_and_statsmodels_on_friedman1()
    {
        // scipy.stats.spearmanr of each float32 feature against y; BH q by statsmodels multipletests(fdr_bh).
        var (matrix, y) = Friedman1Data.Load();
        var rows = MeasuredOutcomeScreen.Compute(matrix, y);
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "regression", "regression_reference.json")));
        var spearman = json.RootElement.GetProperty("spearman");
        var rho = spearman.GetProperty("rho").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var p = spearman.GetProperty("p").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var q = spearman.GetProperty("q").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        for (int f = 0; f < rows.Length; f++)
        {
            Assert.Equal(rho[f], rows[f].Rho, 1e-10);
            Assert.Equal(p[f], rows[f].PValue, Math.Max(1e-12, p[f] * 1e-7));
            Assert.Equal(q[f], rows[f].QValue, Math.Max(1e-12, q[f] * 1e-7));
            Assert.Equal(300, rows[f].Pairs);
        }
        // y rises by 10 x4 (Friedman 1991): the lab reads "rises with the outcome".
        Assert.Equal("rises with the outcome", rows[3].Direction);
    }

    [Fact]
    public void Spearman_rows_match_scipy_on_the_diabetes_data_with_their_intervals()
    {
        // Public data: Efron et al. (2004) diabetes progression, 442 x 10, as shipped with
        // scikit-learn (reference/regression/make_diabetes_reference.py). rho and p from
        // scipy.stats.spearmanr; the 95% interval written out in that script as
        // tanh(atanh(rho) +/- 1.96 sqrt((1 + rho^2/2)/(n - 3))) (Bonett & Wright 2000), since scipy
        // 1.10 gives no interval. Ranks do not change when the CSV values are read as float32.
        var (matrix, y) = ReferenceTables.Measured("regression", "diabetes.csv");
        var rows = MeasuredOutcomeScreen.Compute(matrix, y);
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "regression", "diabetes_reference.json")));
        var reference = json.RootElement.GetProperty("spearman").EnumerateArray().ToArray();
        Assert.Equal(reference.Length, rows.Length);
        for (int f = 0; f < rows.Length; f++)
        {
            var expected = reference[f];
            Assert.Equal(expected.GetProperty("feature").GetString(), rows[f].FeatureName);
            Assert.Equal(expected.GetProperty("rho").GetDouble(), rows[f].Rho, 1e-10);
            double p = expected.GetProperty("p").GetDouble();
            Assert.Equal(p, rows[f].PValue, Math.Max(1e-300, p * 1e-7));
            Assert.Equal(expected.GetProperty("lower").GetDouble(), rows[f].Interval.Lower, 1e-9);
            Assert.Equal(expected.GetProperty("upper").GetDouble(), rows[f].Interval.Upper, 1e-9);
            Assert.Equal(442, rows[f].Pairs);
        }
        // Body mass index rises with progression (Efron et al. 2004 find it the first variable to enter).
        Assert.Equal("rises with the outcome", rows[2].Direction);
    }

    [Fact]
    public void Below_detection_cells_rank_lowest_and_missing_cells_drop_out()
    {
        // scipy 1.10.1: spearmanr([0, 0, 1, 2, 3], [1, 2, 3, 4, 5]) = 0.9746794344808963, p = 0.004818230468198566
        // (two cells tied lowest stand for the below-detection cells; the sixth sample is missing).
        var builder = new FeatureMatrixBuilder(["m"], ["a", "b", "c", "d", "e", "f"]);
        builder.SetBelowDetection(0, 0, 0.5f);
        builder.SetBelowDetection(0, 1, float.NaN);
        builder.SetMeasured(0, 2, 1);
        builder.SetMeasured(0, 3, 2);
        builder.SetMeasured(0, 4, 3);
        builder.SetMissing(0, 5);
        var row = MeasuredOutcomeScreen.Compute(builder.Build(), [1, 2, 3, 4, 5, 6])[0];
        Assert.Equal(5, row.Pairs);
        Assert.Equal(0.9746794344808963, row.Rho, 1e-12);
        Assert.Equal(0.004818230468198566, row.PValue, 1e-12);
        Assert.Equal(100.0 / 6, row.MissingPercent, 12);
        Assert.Equal(200.0 / 6, row.BelowDetectionPercent, 12);
    }

    [Fact]
    public void Follow_up_rows_match_r_survival()
    {
        // R survival 3.5.3: coxph(Surv(time, status) ~ I(x / sd(x))) hazard ratio per SD, Wald
        // interval, score-test p; concordance(..., reverse = TRUE); p.adjust(..., "BH") over 20 markers.
        var (matrix, followUp) = SurvivalForestData.Load();
        var rows = FollowUpScreen.Compute(matrix, followUp.Times, followUp.Events);
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "survival", "survival_forest_reference.json")));
        var reference = json.RootElement.GetProperty("univariate").EnumerateArray().ToArray();
        for (int f = 0; f < rows.Length; f++)
        {
            var r = reference[f];
            Assert.Equal(r.GetProperty("marker").GetString(), rows[f].FeatureName);
            Assert.Equal(r.GetProperty("hr_per_sd").GetDouble(), rows[f].HazardRatioPerSd, 1e-6);
            Assert.Equal(r.GetProperty("hr_lower").GetDouble(), rows[f].HazardRatioInterval.Lower, 1e-6);
            Assert.Equal(r.GetProperty("hr_upper").GetDouble(), rows[f].HazardRatioInterval.Upper, 1e-6);
            Assert.Equal(r.GetProperty("score_p").GetDouble(), rows[f].PValue, Math.Max(1e-12, r.GetProperty("score_p").GetDouble() * 1e-6));
            Assert.Equal(r.GetProperty("q").GetDouble(), rows[f].QValue, Math.Max(1e-12, r.GetProperty("q").GetDouble() * 1e-6));
            Assert.Equal(r.GetProperty("concordance").GetDouble(), rows[f].Concordance.Concordance, 1e-9);
        }
        // By construction (hazard 0.1 exp(0.8 x1 - 0.6 x2 + ...)): x1 shortens survival, x2 lengthens it.
        Assert.Equal("higher values, shorter survival", rows[0].Direction);
        Assert.Equal("higher values, longer survival", rows[1].Direction);
    }

    [Fact]
    public void Tables_do_not_depend_on_the_thread_count()
    {
        // Common practice of this project: results are stored by feature index.
        var (matrix, followUp) = SurvivalForestData.Load();
        var one = FollowUpScreen.Compute(matrix, followUp.Times, followUp.Events, threadCount: 1);
        var two = FollowUpScreen.Compute(matrix, followUp.Times, followUp.Events, threadCount: 2);
        Assert.Equal(one, two);
    }
}
