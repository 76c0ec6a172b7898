using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class AucIntervalTests
{
    private const double Z975 = 1.959963984540054; // standard normal 0.975 quantile (common practice)

    [Fact]
    public void Default_interval_is_symmetric_on_the_auc_scale()
    {
        var interval = AucInterval.Compute(0.7, 0.05);
        Assert.Equal(0.7 - Z975 * 0.05, interval.Lower, 12);
        Assert.Equal(0.7 + Z975 * 0.05, interval.Upper, 12);
        Assert.Equal(0.95, interval.Level);
    }

    [Fact]
    public void Default_interval_is_clipped_to_the_unit_interval()
    {
        var interval = AucInterval.Compute(0.97, 0.03);
        Assert.Equal(1.0, interval.Upper);
        Assert.Equal(0.97 - Z975 * 0.03, interval.Lower, 12);
    }

    [Fact]
    public void Logit_interval_is_the_back_transformed_delta_method_interval()
    {
        // logit(0.97) = ln(0.97 / 0.03); SE on the logit scale = 0.03 / (0.97 * 0.03) = 1 / 0.97.
        var interval = AucInterval.Compute(0.97, 0.03, 0.95, AucIntervalScale.Logit);
        double logit = Math.Log(0.97 / 0.03), halfWidth = Z975 / 0.97;
        Assert.Equal(1 / (1 + Math.Exp(-(logit - halfWidth))), interval.Lower, 12);
        Assert.Equal(1 / (1 + Math.Exp(-(logit + halfWidth))), interval.Upper, 12);
        Assert.True(interval.Upper < 1 && interval.Lower > 0);
    }

    [Fact]
    public void A_perfect_auc_on_the_logit_scale_collapses_to_the_point()
    {
        var interval = AucInterval.Compute(1.0, 0.0, 0.95, AucIntervalScale.Logit);
        Assert.Equal(1.0, interval.Lower);
        Assert.Equal(1.0, interval.Upper);
    }

    [Fact]
    public void A_missing_standard_error_gives_an_undefined_interval()
    {
        Assert.True(double.IsNaN(AucInterval.Compute(0.6, double.NaN).Lower));
    }
}
