using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics.Survival;

/// <summary>
/// Source of every expected value: survival_reference.json, computed by R's survival package 3.5.3
/// (survfit, survdiff, coxph, concordance) on the Freireich et al. (1963) leukaemia trial and two
/// invented data sets; script and provenance in tests/OmicsScreen.TestSupport/reference/survival.
/// </summary>
public sealed class SurvivalStatisticsTests
{
    public static IEnumerable<object[]> DataSets() => SurvivalReference.DataSetNames();

    [Theory]
    [MemberData(nameof(DataSets))]
    public void Kaplan_meier_and_nelson_aalen_match_survfit(string name)
    {
        var set = SurvivalReference.Get(name);
        var curve = KaplanMeier.Estimate(set.Time, set.Event);
        Assert.Equal(set.Doubles("km_time"), curve.Time);
        Assert.Equal(set.Doubles("km_n_risk"), curve.AtRisk.Select(v => (double)v).ToArray());
        Assert.Equal(set.Doubles("km_n_event"), curve.Events.Select(v => (double)v).ToArray());
        AssertClose(set.Doubles("km_survival"), curve.Survival, 1e-12);
        AssertClose(set.Doubles("km_greenwood_se"), curve.GreenwoodError, 1e-12);
        AssertClose(set.Doubles("km_cumhaz_nelson_aalen"), curve.CumulativeHazard, 1e-12);
        Assert.Equal(set.Number("km_median"), curve.Median, 12);
        Assert.Equal(set.Number("reverse_km_median"), KaplanMeier.MedianFollowUp(set.Time, set.Event), 12);
    }

    [Theory]
    [MemberData(nameof(DataSets))]
    public void Log_rank_matches_survdiff(string name)
    {
        var set = SurvivalReference.Get(name);
        var group = set.Doubles("logrank_group").Select(g => g == 1).ToArray();
        var result = LogRankTest.TwoGroups(set.Time, set.Event, group);
        Assert.Equal(set.Number("logrank_chisq"), result.ChiSquare, 1e-9);
        Assert.Equal(set.Number("logrank_p"), result.PValue, 1e-12);
    }

    [Theory]
    [MemberData(nameof(DataSets))]
    public void Cox_fit_with_efron_ties_matches_coxph(string name)
    {
        var set = SurvivalReference.Get(name);
        var fit = CoxSingleMarker.Fit(set.Time, set.Event, set.Marker);
        Assert.True(fit.Converged);
        // coxph stops at a relative log-likelihood change of 1e-9, so its coefficient carries ~1e-6.
        Assert.Equal(set.Number("cox_efron_coef"), fit.Coefficient, 1e-6);
        Assert.Equal(set.Number("cox_efron_se"), fit.StandardError, 1e-6);
        var loglik = set.Pair("cox_efron_loglik");
        Assert.Equal(loglik[0], fit.LogLikelihoodNull, 1e-9);
        Assert.Equal(loglik[1], fit.LogLikelihood, 1e-8);
        Assert.Equal(set.Number("cox_efron_score_chisq"), fit.ScoreChiSquare, 1e-9);
        Assert.Equal(1, set.Number("cox_efron_score_p") / fit.ScorePValue, 1e-8);
        Assert.Equal(1, set.Number("cox_efron_wald_p") / fit.WaldPValue, 1e-4);
        Assert.Equal(set.Number("cox_efron_per_sd_hr"), fit.HazardRatioPerSd, 1e-6);
        Assert.Equal(set.Number("cox_efron_per_sd_hr_lower"), fit.HazardRatioPerSdInterval.Lower, 1e-6);
        Assert.Equal(set.Number("cox_efron_per_sd_hr_upper"), fit.HazardRatioPerSdInterval.Upper, 1e-6);
    }

    [Theory]
    [MemberData(nameof(DataSets))]
    public void The_score_test_alone_matches_coxph_score_test(string name)
    {
        // R survival's coxph score (log-rank) test, as in the full fit above; the screen calls this without the Newton steps.
        var set = SurvivalReference.Get(name);
        var (chiSquare, p) = CoxSingleMarker.ScoreTest(set.Time, set.Event, set.Marker);
        Assert.Equal(set.Number("cox_efron_score_chisq"), chiSquare, 1e-9);
        Assert.Equal(1, set.Number("cox_efron_score_p") / p, 1e-8);
    }

    [Theory]
    [MemberData(nameof(DataSets))]
    public void Harrells_c_and_its_jackknife_variance_match_concordance(string name)
    {
        var set = SurvivalReference.Get(name);
        var c = HarrellConcordance.Estimate(set.Time, set.Event, set.Marker);
        Assert.Equal(set.Count("concordant"), c.Concordant);
        Assert.Equal(set.Count("discordant"), c.Discordant);
        Assert.Equal(set.Count("tied.x"), c.TiedScore);
        Assert.Equal(set.Number("concordance_higher_is_riskier"), c.Concordance, 1e-12);
        Assert.Equal(Math.Sqrt(set.Number("concordance_var")), c.StandardError, 1e-12);
    }

    [Fact]
    public void Concordance_reverses_with_the_score_and_ignores_sample_order()
    {
        // Follows from the definition: C(-x) = (discordant + tied/2) / pairs = 1 - C(x); and C does not depend on row order.
        var set = SurvivalReference.Get("invented_continuous");
        var forward = HarrellConcordance.Estimate(set.Time, set.Event, set.Marker);
        var negated = HarrellConcordance.Estimate(set.Time, set.Event, set.Marker.Select(v => -v).ToArray());
        Assert.Equal(1 - forward.Concordance, negated.Concordance, 1e-12);
        Assert.Equal(forward.Concordant, negated.Discordant);
        var order = Enumerable.Range(0, set.Time.Length).Reverse().ToArray();
        var shuffled = HarrellConcordance.Estimate(
            order.Select(i => set.Time[i]).ToArray(), order.Select(i => set.Event[i]).ToArray(), order.Select(i => set.Marker[i]).ToArray());
        Assert.Equal(forward.Concordance, shuffled.Concordance);
        Assert.Equal(forward.StandardError, shuffled.StandardError, 1e-15);
    }

    [Fact]
    public void A_marker_that_orders_events_perfectly_does_not_converge_but_keeps_its_score_test()
    {
        // Monotone likelihood (common practice: the Cox estimate is infinite when a covariate orders
        // every event before every later time); the score test at beta = 0 stays finite.
        double[] time = [1, 2, 3, 4, 5, 6, 7, 8];
        bool[] events = [true, true, true, true, true, true, true, true];
        double[] marker = [8, 7, 6, 5, 4, 3, 2, 1];
        var fit = CoxSingleMarker.Fit(time, events, marker);
        Assert.False(fit.Converged);
        Assert.True(double.IsFinite(fit.ScoreChiSquare) && fit.ScoreChiSquare > 0);
        Assert.Equal(1.0, HarrellConcordance.Estimate(time, events, marker).Concordance);
    }

    private static void AssertClose(double[] expected, double[] actual, double tolerance)
    {
        Assert.Equal(expected.Length, actual.Length);
        for (int i = 0; i < expected.Length; i++) Assert.Equal(expected[i], actual[i], tolerance);
    }
}
