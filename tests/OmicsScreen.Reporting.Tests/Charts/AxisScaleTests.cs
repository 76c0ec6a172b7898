using OmicsScreen.Reporting.Charts;

namespace OmicsScreen.Reporting.Tests.Charts;

public class AxisScaleTests
{
    [Fact]
    public void Linear_ticks_carry_labels_with_the_decimals_the_step_needs()
    {
        var scale = LinearScale.Nice(0.0012, 0.0087);
        Assert.Equal(["0.000", "0.002", "0.004", "0.006", "0.008", "0.010"], scale.Ticks.Select(tick => tick.Label));
        Assert.Equal(0.5, scale.Fraction(0.005), 12);
    }

    [Fact]
    public void Fixed_linear_axis_keeps_its_ends_and_only_ticks_inside_them()
    {
        var scale = LinearScale.Fixed(0.5, 1);
        Assert.Equal((0.5, 1.0), (scale.Minimum, scale.Maximum));
        Assert.Equal(["0.5", "0.6", "0.7", "0.8", "0.9", "1.0"], scale.Ticks.Select(tick => tick.Label));
    }

    [Fact]
    public void Log_axis_spans_whole_decades_with_plain_labels()
    {
        var scale = LogScale.Create(0.5, 2000);
        Assert.Equal(["0.1", "1", "10", "100", "1000", "10000"], scale.Ticks.Select(tick => tick.Label));
        Assert.Equal(0.4, scale.Fraction(10), 12); // log10: (1 - (-1)) / (4 - (-1))
        Assert.False(scale.CanShow(0));
        Assert.False(scale.CanShow(-1));
    }

    [Fact]
    public void Narrow_log_axis_adds_two_and_five_times_ticks()
    {
        var scale = LogScale.Create(3, 40);
        Assert.Equal(["1", "2", "5", "10", "20", "50", "100"], scale.Ticks.Select(tick => tick.Label));
    }

    [Fact]
    public void Extreme_decades_use_exponent_labels()
    {
        var scale = LogScale.Create(1e-7, 1e-5);
        Assert.Equal("1e-07", scale.Ticks[0].Label);
    }

    [Fact]
    public void No_data_gives_a_unit_axis_rather_than_failing()
    {
        var scale = LinearScale.Nice(double.PositiveInfinity, double.NegativeInfinity);
        Assert.Equal((0.0, 1.0), (scale.Minimum, scale.Maximum));
    }
}
