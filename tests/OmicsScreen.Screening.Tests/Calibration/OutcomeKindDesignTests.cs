using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Screening.Tests.Calibration;

/// <summary>
/// The measured-outcome and follow-up models of the calibration suite (issues 17, 18): sizes,
/// kinds, censoring as designed, and planted effects of the size the models say.
/// </summary>
public class OutcomeKindDesignTests
{
    private const int LargeCohort = 4000;

    [Theory]
    [InlineData("measured-null-normal", OutcomeKind.Measured, 150, 1000, 0)]
    [InlineData("measured-null-skewed", OutcomeKind.Measured, 150, 1000, 0)]
    [InlineData("measured-null-blocks", OutcomeKind.Measured, 150, 1000, 0)]
    [InlineData("measured-null-small", OutcomeKind.Measured, 60, 1000, 0)]
    [InlineData("measured-planted", OutcomeKind.Measured, 150, 1000, 16)]
    [InlineData("follow-up-null-light-censoring", OutcomeKind.TimeToEvent, 150, 1000, 0)]
    [InlineData("follow-up-null-heavy-censoring", OutcomeKind.TimeToEvent, 150, 1000, 0)]
    [InlineData("follow-up-null-tied", OutcomeKind.TimeToEvent, 150, 1000, 0)]
    [InlineData("follow-up-null-small", OutcomeKind.TimeToEvent, 60, 1000, 0)]
    [InlineData("follow-up-planted", OutcomeKind.TimeToEvent, 150, 1000, 5)]
    public void Each_design_has_its_kind_size_and_number_of_related_features(string name, OutcomeKind kind, int samples, int features, int related)
    {
        var model = CalibrationCatalogue.Create(name, 1);
        var panel = model.Discovery();
        Assert.Equal(kind, model.Kind);
        Assert.Equal(kind, panel.Kind);
        Assert.Equal(samples, panel.SampleCount);
        Assert.Equal(features, panel.FeatureCount);
        Assert.Equal(related, model.RelatedCount);
        Assert.Equal(0, model.ClassCount);
        // Design numbers 12-21 follow the eleven class designs: model seed = 100 x seed number + number.
        Assert.InRange(model.Seed, 112UL, 121UL);
    }

    [Theory]
    [InlineData("follow-up-null-light-censoring", 0.30)]
    [InlineData("follow-up-null-heavy-censoring", 0.70)]
    [InlineData("follow-up-null-tied", 0.30)]
    public void A_null_follow_up_is_censored_in_the_designed_share(string name, double share)
    {
        // Censored share hc / (h0 + hc) for two racing exponentials (common practice); binomial SD
        // over 4,000 samples is at most 0.008, so 0.03 is about 4 SDs.
        var panel = CalibrationCatalogue.Create(name, 2).DrawFreshCohort(LargeCohort);
        double censored = 1 - panel.FollowUp!.EventCount / (double)panel.SampleCount;
        Assert.InRange(censored, share - 0.03, share + 0.03);
    }

    [Fact]
    public void The_tied_shape_records_whole_years_so_many_samples_share_a_time()
    {
        var panel = CalibrationCatalogue.Create("follow-up-null-tied", 1).Discovery();
        var times = panel.FollowUp!.Times.ToArray();
        Assert.All(times, t => Assert.Equal(Math.Ceiling(t), t));
        Assert.All(times, t => Assert.True(t >= 1));
        // Observed time ~ Exp(0.1 / 0.7): mean 7 years, so 150 samples fall in a few dozen whole years.
        Assert.InRange(times.Distinct().Count(), 10, 45);
    }

    [Fact]
    public void The_small_follow_up_study_has_about_forty_events()
    {
        // 60 samples x 0.7 = 42 expected events, binomial SD 3.5.
        for (int seed = 1; seed <= 5; seed++)
            Assert.InRange(CalibrationCatalogue.Create("follow-up-null-small", seed).Discovery().FollowUp!.EventCount, 30, 54);
    }

    [Theory]
    [InlineData("measured-null-normal")]
    [InlineData("measured-null-skewed")]
    [InlineData("measured-null-blocks")]
    [InlineData("measured-null-small")]
    [InlineData("follow-up-null-light-censoring")]
    [InlineData("follow-up-null-heavy-censoring")]
    [InlineData("follow-up-null-tied")]
    [InlineData("follow-up-null-small")]
    public void Rank_test_p_values_of_a_null_shape_are_roughly_uniform(string name)
    {
        // Under no association p ~ U(0, 1) (common practice); blocks make the p-values dependent, so
        // the bounds are wide, as in NullShapeTests. Spearman for a measured outcome, the Cox score
        // test on the marker's ranks for follow-up (the screen's own rank tests).
        var pValues = new List<double>();
        for (int seed = 1; seed <= 3; seed++)
        {
            var panel = CalibrationCatalogue.Create(name, seed).Discovery();
            for (int f = 0; f < panel.FeatureCount; f++) pValues.Add(RankTestP(panel, f));
        }
        double small = pValues.Count(p => p <= 0.05) / (double)pValues.Count;
        Assert.InRange(small, 0.02, 0.09);
        Assert.InRange(pValues.Average(), 0.46, 0.54);
    }

    [Fact]
    public void The_measured_design_steps_up_at_the_threshold_and_rises_with_its_blocks()
    {
        var model = (MeasuredPlantedModel)CalibrationCatalogue.Create("measured-planted", 1);
        var panel = model.DrawFreshCohort(LargeCohort);
        var y = panel.Measured!.Values.ToArray();
        var marker = CalibrationValues.Standardised(model, panel, model.ThresholdMarker);
        double above = 0, below = 0;
        int aboveCount = 0;
        for (int s = 0; s < y.Length; s++)
            if (marker[s] > ThresholdModel.UpperQuartile) { above += y[s]; aboveCount++; }
            else below += y[s];
        // Mean step gamma = 1.2; the rest of y has SD sqrt(1.95) = 1.4, so the step's SE over
        // 1,000 and 3,000 samples is 0.05: 0.2 is 4 SEs.
        double step = above / aboveCount - below / (y.Length - aboveCount);
        Assert.InRange(step, model.ThresholdEffect - 0.2, model.ThresholdEffect + 0.2);
        // A member of block b correlates sqrt(rho + (1 - rho) / k) beta_b / SD(y) with y = 0.825 beta_b / 1.49
        // (the model's remarks); SE of a correlation over 4,000 samples is about 0.015.
        for (int b = 0; b < model.InformativeBlocks.Count; b++)
        {
            int member = model.InformativeBlocks[b] * model.Background.BlockSize;
            double expected = Math.Sqrt(0.6 + 0.4 / 5) * model.Effects[b] / Math.Sqrt(2.2225);
            double r = Pearson(CalibrationValues.Standardised(model, panel, member), y);
            Assert.InRange(r, expected - 0.06, expected + 0.06);
        }
    }

    [Fact]
    public void The_follow_up_design_is_a_cox_model_with_its_log_hazard_as_the_linear_predictor()
    {
        // Event times exponential with hazard h0 exp(eta) and independent censoring: a Cox model of
        // the true eta alone has coefficient 1 (Cox 1972); its SE over ~2,800 events is about 0.02.
        var model = (FollowUpPlantedModel)CalibrationCatalogue.Create("follow-up-planted", 1);
        var panel = model.DrawFreshCohort(LargeCohort);
        var eta = new double[panel.SampleCount];
        var threshold = CalibrationValues.Standardised(model, panel, model.ThresholdMarker);
        for (int s = 0; s < eta.Length; s++) eta[s] = threshold[s] > ThresholdModel.UpperQuartile ? model.ThresholdLogHazardRatio : 0;
        for (int m = 0; m < model.Markers.Count; m++)
        {
            var x = CalibrationValues.Standardised(model, panel, model.Markers[m]);
            for (int s = 0; s < eta.Length; s++) eta[s] += model.LogHazardRatios[m] * x[s];
        }
        var fit = CoxSingleMarker.Fit(panel.FollowUp!.Times, panel.FollowUp.Events, eta);
        Assert.InRange(fit.Coefficient, 0.92, 1.08);
        // Higher hazards end follow-up sooner, so fewer are censored than the 30% of the baseline.
        double censored = 1 - panel.FollowUp.EventCount / (double)panel.SampleCount;
        Assert.InRange(censored, 0.10, 0.30);
    }

    private static double RankTestP(Panel panel, int feature)
    {
        var x = panel.Matrix.Column(feature).ToArray().Select(v => (double)v).ToArray();
        if (panel.Kind == OutcomeKind.Measured) return SpearmanTest.Test(x, panel.Measured!.Values).PValue;
        return CoxSingleMarker.Fit(panel.FollowUp!.Times, panel.FollowUp.Events, Ranking.Rank(x)).ScorePValue;
    }

    private static double Pearson(double[] x, double[] y)
    {
        double mx = x.Average(), my = y.Average(), sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++)
        {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
            syy += (y[i] - my) * (y[i] - my);
        }
        return sxy / Math.Sqrt(sxx * syy);
    }
}
