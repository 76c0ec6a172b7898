using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Screening.Tests.Locking;

public class CalibrationLineTests
{
    /// <summary>
    /// Source: R's lm(dist ~ speed, data = cars) with confint (reference/apply/make_apply_reference.R;
    /// Ezekiel 1930's 50 cars): intercept -17.579, slope 3.932 (also the textbook values, from
    /// memory), their 95% t intervals on 48 degrees of freedom and the residual standard error.
    /// </summary>
    [Fact]
    public void Slope_intercept_and_intervals_equal_r_lm_on_the_cars_data()
    {
        var reference = ApplyReferenceData.Root.GetProperty("calibration_cars");
        var predicted = ApplyReferenceData.Doubles(reference.GetProperty("predicted"));
        var observed = ApplyReferenceData.Doubles(reference.GetProperty("observed"));

        var line = CalibrationLine.Fit(predicted, observed);

        Assert.Equal(reference.GetProperty("slope").GetDouble(), line.Slope, 1e-10);
        Assert.Equal(reference.GetProperty("intercept").GetDouble(), line.Intercept, 1e-10);
        Assert.Equal(reference.GetProperty("slope_lower").GetDouble(), line.SlopeInterval.Lower, 1e-8);
        Assert.Equal(reference.GetProperty("slope_upper").GetDouble(), line.SlopeInterval.Upper, 1e-8);
        Assert.Equal(reference.GetProperty("intercept_lower").GetDouble(), line.InterceptInterval.Lower, 1e-8);
        Assert.Equal(reference.GetProperty("intercept_upper").GetDouble(), line.InterceptInterval.Upper, 1e-8);
        Assert.Equal(reference.GetProperty("residual_standard_error").GetDouble(), line.ResidualStandardError, 1e-10);
    }

    [Fact]
    public void Predictions_that_do_not_vary_give_no_line_and_two_samples_no_interval()
    {
        var flat = CalibrationLine.Fit([2.0, 2.0, 2.0], [1.0, 2.0, 3.0]);
        Assert.True(double.IsNaN(flat.Slope));
        var two = CalibrationLine.Fit([1.0, 2.0], [3.0, 5.0]);
        Assert.Equal(2.0, two.Slope, 1e-15);
        Assert.Equal(1.0, two.Intercept, 1e-15);
        Assert.True(double.IsNaN(two.SlopeInterval.Lower));
    }
}
