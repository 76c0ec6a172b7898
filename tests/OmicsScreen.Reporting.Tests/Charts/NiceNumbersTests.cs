using OmicsScreen.Reporting.Charts;

namespace OmicsScreen.Reporting.Tests.Charts;

public class NiceNumbersTests
{
    // Heckbert (1990), "Nice numbers for graph labels", Graphics Gems I: nicenum rounds to 1, 2, 5 or 10
    // times a power of ten; with round the cut points are 1.5, 3 and 7. Values below worked by hand.
    [Theory]
    [InlineData(438, false, 500)]
    [InlineData(125, true, 100)]
    [InlineData(0.0075, false, 0.01)]
    [InlineData(0.0025, true, 0.002)]
    [InlineData(2.98, false, 5)]
    [InlineData(1.25, true, 1)]
    [InlineData(3, true, 5)]
    [InlineData(7, true, 10)]
    [InlineData(2, false, 2)]
    public void Nice_number_follows_Heckbert(double value, bool round, double expected) =>
        Assert.Equal(expected, NiceNumbers.NiceNumber(value, round), 1e-12);

    // Heckbert's loose labelling worked by hand: data 105..543 with 5 ticks -> range nicenum(438) = 500,
    // step nicenum(125, round) = 100, axis 100..600 (the paper's own example range, from memory).
    [Fact]
    public void Loose_ticks_for_Heckberts_example_range_run_from_100_to_600_by_100()
    {
        var ticks = NiceNumbers.LooseTicks(105, 543, 5);
        Assert.Equal((100.0, 600.0, 100.0, 0), (ticks.First, ticks.Last, ticks.Step, ticks.FractionDigits));
        Assert.Equal(6, ticks.TickCount);
    }

    [Theory] // worked by hand with Heckbert's algorithm
    [InlineData(0, 1, 0, 1, 0.2, 1)]
    [InlineData(-0.37, 2.61, -1, 3, 1, 0)]
    [InlineData(0.0012, 0.0087, 0, 0.01, 0.002, 3)]
    public void Loose_ticks_match_hand_worked_cases(double minimum, double maximum, double first, double last, double step, int digits)
    {
        var ticks = NiceNumbers.LooseTicks(minimum, maximum, 5);
        Assert.Equal(first, ticks.First, 1e-12);
        Assert.Equal(last, ticks.Last, 1e-12);
        Assert.Equal(step, ticks.Step, 1e-12);
        Assert.Equal(digits, ticks.FractionDigits);
    }

    [Fact]
    public void A_single_value_still_gets_an_axis_around_it()
    {
        var ticks = NiceNumbers.LooseTicks(5, 5);
        Assert.True(ticks.First < 5 && ticks.Last > 5);
        var zero = NiceNumbers.LooseTicks(0, 0);
        Assert.True(zero.First < 0 && zero.Last > 0);
    }
}
