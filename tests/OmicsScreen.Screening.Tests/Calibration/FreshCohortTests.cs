using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Screening.Tests.Calibration;

/// <summary>A fresh cohort comes from the same model as the discovery panel, with new samples.</summary>
public class FreshCohortTests
{
    [Theory]
    [InlineData("null-censored")]
    [InlineData("planted-blocks")]
    [InlineData("planted-threshold")]
    public void A_fresh_cohort_has_the_same_features_and_truth_but_new_samples(string name)
    {
        var model = CalibrationCatalogue.Create(name, 3);
        var discovery = model.Discovery();
        var fresh = model.DrawFreshCohort(2000);
        Assert.Equal(discovery.Matrix.FeatureNames, fresh.Matrix.FeatureNames);
        Assert.Equal(2000, fresh.SampleCount);
        Assert.Empty(discovery.Matrix.SampleIds.Intersect(fresh.Matrix.SampleIds));
        Assert.NotEqual(discovery.Matrix.Column(0)[..10].ToArray(), fresh.Matrix.Column(0)[..10].ToArray());
        // The truth belongs to the model: a second model from the same seed plants the same features.
        Assert.Equal(model.Truth, CalibrationCatalogue.Create(name, 3).Truth);
    }

    [Fact]
    public void Feature_means_of_a_fresh_cohort_agree_with_discovery_within_sampling_error()
    {
        // Standardised values have SD 1, so the difference of two means has SD sqrt(1/150 + 1/2000)
        // = 0.085 (common practice); with 1,000 features about 3 exceed 3 SDs by chance (normal tail
        // 0.0027), a handful more through the block correlation. A fresh cohort drawn from other
        // feature parameters would differ by about 1.7 SDs of mu alone, on every feature.
        var model = CalibrationCatalogue.Create("null-blocks", 2);
        var discovery = model.Discovery();
        var fresh = model.DrawFreshCohort(2000);
        double limit = 3 * Math.Sqrt(1.0 / 150 + 1.0 / 2000);
        int beyond = 0;
        for (int f = 0; f < model.FeatureCount; f++)
        {
            double difference = CalibrationValues.Standardised(model, discovery, f).Average()
                - CalibrationValues.Standardised(model, fresh, f).Average();
            if (Math.Abs(difference) > limit) beyond++;
        }
        Assert.True(beyond <= 20, $"{beyond} of 1000 feature means differ by more than 3 SDs");
    }

    [Fact]
    public void The_same_seed_and_cohort_number_draw_the_same_cohort_and_other_numbers_do_not()
    {
        var model = CalibrationCatalogue.Create("planted-interaction", 1);
        var again = CalibrationCatalogue.Create("planted-interaction", 1);
        Assert.Equal(model.Discovery().Matrix.Column(5).ToArray(), again.Discovery().Matrix.Column(5).ToArray());
        Assert.Equal(model.DrawFreshCohort(300, 1).Outcome.SampleClasses.ToArray(), again.DrawFreshCohort(300, 1).Outcome.SampleClasses.ToArray());
        Assert.NotEqual(model.DrawFreshCohort(300, 1).Matrix.Column(5).ToArray(), model.DrawFreshCohort(300, 2).Matrix.Column(5).ToArray());
        Assert.NotEqual(model.Discovery().Matrix.Column(5).ToArray(),
            CalibrationCatalogue.Create("planted-interaction", 2).Discovery().Matrix.Column(5).ToArray());
    }
}
