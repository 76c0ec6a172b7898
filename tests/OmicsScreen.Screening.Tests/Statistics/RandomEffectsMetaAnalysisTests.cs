using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public class RandomEffectsMetaAnalysisTests
{
    [Fact]
    public void DerSimonian_laird_matches_statsmodels_combine_effects()
    {
        // Source: stats_reference.json "meta_analysis", statsmodels 0.13.5 combine_effects(method_re="dl")
        // (tau2 and I2 truncated at 0 where statsmodels does not; see the README there).
        foreach (var item in StatsReference.Block("meta_analysis"))
        {
            string name = item.GetProperty("name").GetString()!;
            var result = RandomEffectsMetaAnalysis.DerSimonianLaird(item.Doubles("estimates"), item.Doubles("variances"));
            Tolerance.Relative(item.Number("fixed_estimate"), result.FixedEstimate, 1e-6, name + " fixed");
            Tolerance.Relative(item.Number("fixed_se"), result.FixedStandardError, 1e-6, name + " fixed SE");
            Tolerance.Relative(item.Number("q"), result.Q, 1e-6, name + " Q");
            Assert.Equal(item.GetProperty("df").GetInt32(), result.DegreesOfFreedom);
            Tolerance.Relative(item.Number("q_p"), result.QPValue, 1e-6, name + " Q p");
            Tolerance.Absolute(item.Number("tau2"), result.Tau2, 1e-6 * Math.Max(1, item.Number("tau2")), name + " tau2");
            Tolerance.Absolute(item.Number("i2"), result.I2, 1e-6, name + " I2");
            Tolerance.Relative(item.Number("h2"), result.H2, 1e-6, name + " H2");
            Tolerance.Relative(item.Number("random_estimate"), result.RandomEstimate, 1e-6, name + " random");
            Tolerance.Relative(item.Number("random_se"), result.RandomStandardError, 1e-6, name + " random SE");
            Tolerance.Relative(item.Number("random_ci_lower"), result.RandomInterval.Lower, 1e-6, name + " lower");
            Tolerance.Relative(item.Number("random_ci_upper"), result.RandomInterval.Upper, 1e-6, name + " upper");
        }
    }

    [Fact]
    public void Bcg_trials_give_the_published_tau2_and_pooled_log_risk_ratio()
    {
        // Colditz et al. (1994) BCG trials: DerSimonian-Laird tau^2 = 0.3088 and pooled log risk
        // ratio -0.7141, the values usually quoted for this example (from memory).
        var bcg = StatsReference.Block("meta_analysis").First(b => b.GetProperty("name").GetString() == "bcg_log_risk_ratio");
        var result = RandomEffectsMetaAnalysis.DerSimonianLaird(bcg.Doubles("estimates"), bcg.Doubles("variances"));
        Assert.Equal(0.3088, result.Tau2, 0.00005);
        Assert.Equal(-0.7141, result.RandomEstimate, 0.00005);
    }

    [Fact]
    public void A_single_study_has_no_heterogeneity_statistics()
    {
        var result = RandomEffectsMetaAnalysis.DerSimonianLaird([0.4], [0.04]);
        Assert.Equal(0.4, result.RandomEstimate);
        Assert.Equal(0.2, result.RandomStandardError, 14);
        Assert.Equal(0, result.Tau2);
        Assert.True(double.IsNaN(result.I2) && double.IsNaN(result.H2) && double.IsNaN(result.QPValue));
    }

    [Fact]
    public void Equal_estimates_have_zero_heterogeneity()
    {
        var result = RandomEffectsMetaAnalysis.DerSimonianLaird([0.3, 0.3, 0.3], [0.01, 0.02, 0.05]);
        Assert.Equal(0, result.Q, 14);
        Assert.Equal(0, result.Tau2);
        Assert.Equal(0, result.I2);
        Assert.Equal(result.FixedEstimate, result.RandomEstimate, 14);
    }
}
