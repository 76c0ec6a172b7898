using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public class MannWhitneyTests
{
    [Fact]
    public void U_auc_and_p_match_scipy_on_every_wdbc_feature()
    {
        // Source: reference/wdbc/feature_stats.csv, scipy.stats.mannwhitneyu(malignant, benign,
        // alternative="two-sided", method="asymptotic") and roc_auc_score (see its README).
        foreach (var (name, expected, malignant, benign) in WdbcFeatureStatistics.Instance.FeaturesByClass())
        {
            var result = MannWhitney.Test(malignant, benign);
            Tolerance.Relative(expected["mw_u_malignant"], result.U, 1e-9, name + " U");
            Tolerance.Relative(expected["auc_malignant"], result.Auc, 1e-9, name + " AUC");
            Tolerance.Relative(expected["mw_p"], result.PValue, 1e-6, name + " p");
        }
    }

    [Fact]
    public void P_values_stay_accurate_far_into_the_tail()
    {
        // Source: reference/stats/stats_reference.json "mann_whitney", scipy.stats.mannwhitneyu
        // asymptotic two-sided; p reaches 8.9e-263, where 1 - cdf would give exactly 0.
        foreach (var item in StatsReference.Block("mann_whitney"))
        {
            var result = MannWhitney.Test(item.Doubles("positive"), item.Doubles("negative"));
            Tolerance.Relative(item.Number("u"), result.U, 1e-12, "U");
            Tolerance.Relative(item.Number("p"), result.PValue, 1e-6, item.GetProperty("name").GetString());
        }
    }

    [Fact]
    public void Auc_is_the_share_of_pairs_won_with_ties_counting_half()
    {
        // By hand: positives {3, 5}, negatives {1, 3, 4}. Pairs won: 3>1, 5>1, 5>3, 5>4 = 4, tie 3=3
        // counts 1/2, so U = 4.5 and AUC = 4.5 / 6 = 0.75.
        var result = MannWhitney.Test([3.0, 5.0], [1.0, 3.0, 4.0]);
        Assert.Equal(4.5, result.U);
        Assert.Equal(0.75, result.Auc);
    }

    [Fact]
    public void Swapping_the_samples_mirrors_the_auc_and_keeps_the_p_value()
    {
        double[] first = [1.2, 3.4, 2.2, 5.0, 5.0, 0.3, 2.2];
        double[] second = [0.1, 2.2, 0.7, 1.0, 3.3];
        var forward = MannWhitney.Test(first, second);
        var backward = MannWhitney.Test(second, first);
        Assert.Equal(1.0, forward.Auc + backward.Auc, 12);
        Assert.Equal(forward.PValue, backward.PValue, 14);
    }

    [Fact]
    public void All_values_tied_gives_auc_one_half_and_p_one()
    {
        var result = MannWhitney.Test([2.0, 2.0, 2.0], [2.0, 2.0]);
        Assert.Equal(0.5, result.Auc);
        Assert.Equal(1.0, result.PValue);
    }

    [Fact]
    public void An_empty_sample_gives_NaN_statistics()
    {
        var result = MannWhitney.Test([], [1.0, 2.0]);
        Assert.True(double.IsNaN(result.Auc));
        Assert.True(double.IsNaN(result.PValue));
    }

    [Fact]
    public void Normal_two_sided_tail_matches_scipy_erfc_down_to_1e_minus_299()
    {
        // Source: stats_reference.json "normal_two_sided", scipy.special.erfc(z / sqrt 2).
        foreach (var item in StatsReference.Block("normal_two_sided"))
            Tolerance.Relative(item.Number("p"), NormalTail.TwoSided(item.Number("z")), 1e-12, "z=" + item.Number("z"));
    }

    [Fact]
    public void Normal_critical_value_for_95_percent_is_1_959964()
    {
        // Source: the standard normal 0.975 quantile, 1.959963984540054 (common practice; MathNet Normal.InvCDF agrees).
        Assert.Equal(1.959963984540054, NormalTail.TwoSidedCritical(0.95), 12);
        Assert.Equal(MathNet.Numerics.Distributions.Normal.InvCDF(0, 1, 0.975), NormalTail.TwoSidedCritical(0.95), 12);
    }
}
