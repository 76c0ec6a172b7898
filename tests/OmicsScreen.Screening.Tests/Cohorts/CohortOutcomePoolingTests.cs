using System.Text.Json;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Cohorts;

/// <summary>
/// Per-cohort effects of measured and time-to-event outcomes and their pooling: the per-cohort
/// values against scipy (reference/regression) and R survival (reference/survival), the pooling
/// against the DerSimonian-Laird formula on the Fisher-z scale with Bonett &amp; Wright's (2000)
/// variance (RandomEffectsMetaAnalysis itself is checked against statsmodels elsewhere).
/// </summary>
public class CohortOutcomePoolingTests
{
    private static SampleGrouping Blocks(int samples, int blockSize) =>
        SampleGrouping.FromLabels("cohort", Enumerable.Range(0, samples).Select(s => "C" + (s / blockSize + 1)).ToArray());

    [Theory]
    [InlineData(0, "x1")]
    [InlineData(3, "x4")]
    public void Spearman_per_cohort_matches_scipy_and_pools_on_fishers_z(int feature, string name)
    {
        // scipy.stats.spearmanr within samples 1-100, 101-200 and 201-300 of Friedman's benchmark.
        var (matrix, y) = Friedman1Data.Load();
        var pooled = CohortOutcomePooling.Spearman(matrix, feature, y, Blocks(300, 100));
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "regression", "regression_reference.json")));
        var rho = json.RootElement.GetProperty("cohort_spearman").GetProperty(name).EnumerateArray().Select(v => v.GetDouble()).ToArray();
        Assert.Equal(3, pooled.Cohorts.Count);
        for (int c = 0; c < 3; c++)
        {
            Assert.Equal(rho[c], pooled.Cohorts[c].Effect, 1e-10);
            Assert.Equal(Math.Atanh(rho[c]), pooled.Cohorts[c].PooledScale, 1e-10);
            Assert.Equal((1 + rho[c] * rho[c] / 2) / 97, pooled.Cohorts[c].Variance, 1e-12);
        }
        var meta = RandomEffectsMetaAnalysis.DerSimonianLaird(rho.Select(Math.Atanh).ToArray(), rho.Select(r => (1 + r * r / 2) / 97).ToArray());
        Assert.Equal(Math.Tanh(meta.RandomEstimate), pooled.PooledEffect, 1e-10);
        Assert.Equal(Math.Tanh(meta.RandomInterval.Lower), pooled.PooledInterval.Lower, 1e-10);
        Assert.Equal(meta.Q, pooled.Pooled!.Q, 1e-10);
    }

    [Theory]
    [InlineData(0, "x1")]
    [InlineData(1, "x2")]
    public void Log_hazard_ratio_per_cohort_matches_r_survival(int feature, string name)
    {
        // R survival 3.5.3: coxph(Surv(time, status) ~ x / sd(x over all samples)) within samples 1-100
        // and 101-200 of the censored reference panel: coefficient and standard error.
        var (matrix, followUp) = SurvivalForestData.Load();
        var pooled = CohortOutcomePooling.LogHazardRatio(matrix, feature, followUp.Times, followUp.Events, Blocks(200, 100));
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "survival", "survival_forest_reference.json")));
        var reference = json.RootElement.GetProperty("cohort_cox").EnumerateArray().Single(e => e.GetProperty("marker").GetString() == name);
        var logHr = reference.GetProperty("log_hr").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var se = reference.GetProperty("se").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        Assert.Equal(2, pooled.Cohorts.Count);
        for (int c = 0; c < 2; c++)
        {
            Assert.Equal(logHr[c], pooled.Cohorts[c].Effect, 1e-6);
            Assert.Equal(se[c] * se[c], pooled.Cohorts[c].Variance, 1e-7);
        }
        var meta = RandomEffectsMetaAnalysis.DerSimonianLaird(logHr, se.Select(v => v * v).ToArray());
        Assert.Equal(meta.RandomEstimate, pooled.PooledEffect, 1e-5);
    }

    [Fact]
    public void A_cohort_too_small_for_an_effect_is_skipped_and_named()
    {
        // Common practice: Fisher's z needs n > 3 (its variance has n - 3 below).
        var (matrix, y) = Friedman1Data.Load();
        var labels = Enumerable.Range(0, 300).Select(s => s < 3 ? "tiny" : "main").ToArray();
        var pooled = CohortOutcomePooling.Spearman(matrix, 0, y, SampleGrouping.FromLabels("cohort", labels));
        Assert.Equal(["tiny"], pooled.Skipped);
        Assert.Single(pooled.Cohorts);
        Assert.Null(pooled.Pooled);
        Assert.True(double.IsNaN(pooled.PooledEffect));
    }
}
