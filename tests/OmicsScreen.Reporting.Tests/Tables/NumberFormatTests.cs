using System.Globalization;
using OmicsScreen.Reporting.Tables;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Tables;

public class NumberFormatTests
{
    [Fact]
    public void Round_trip_text_parses_back_to_the_identical_double()
    {
        double[] values = [0.1, 1.0 / 3, -2.5e-300, 123456789.123456789, double.Epsilon, double.MaxValue, -0.0, Math.PI * 1e20];
        foreach (double value in values)
        {
            string text = NumberFormat.RoundTrip.Format(value);
            Assert.Equal(BitConverter.DoubleToInt64Bits(value), BitConverter.DoubleToInt64Bits(double.Parse(text, CultureInfo.InvariantCulture)));
        }
    }

    // Expected texts worked by hand from .NET's documented "G" and "F" standard format strings.
    [Theory]
    [InlineData(0.000123456, 3, "0.000123")]
    [InlineData(1234567.0, 3, "1.23E+06")]
    [InlineData(0.5, 4, "0.5")]
    [InlineData(-0.5, 4, "-0.5")]
    [InlineData(1.5e-12, 4, "1.5E-12")]
    public void Significant_digits_are_stated_per_column(double value, int digits, string expected) =>
        Assert.Equal(expected, NumberFormat.Significant(digits).Format(value));

    [Theory]
    [InlineData(0.81234, 4, "0.8123")]
    [InlineData(-0.00001, 2, "0.00")]
    [InlineData(-0.5, 2, "-0.50")]
    [InlineData(12.6, 0, "13")]
    public void Fixed_decimals_round_and_drop_the_sign_of_a_rounded_zero(double value, int decimals, string expected) =>
        Assert.Equal(expected, NumberFormat.Fixed(decimals).Format(value));

    [Fact]
    public void Missing_and_infinite_values_have_fixed_spellings()
    {
        foreach (var format in new[] { NumberFormat.RoundTrip, NumberFormat.Significant(4), NumberFormat.Fixed(2) })
        {
            Assert.Equal("NA", format.Format(double.NaN));
            Assert.Equal("Inf", format.Format(double.PositiveInfinity));
            Assert.Equal("-Inf", format.Format(double.NegativeInfinity));
        }
    }

    [Fact]
    public void Numbers_ignore_a_current_culture_with_comma_decimals()
    {
        using var _ = CultureScope.CommaDecimal();
        Assert.Equal("1,5", 1.5.ToString(CultureInfo.CurrentCulture)); // the scope really changes culture-aware formatting
        Assert.Equal("1234.5", NumberFormat.RoundTrip.Format(1234.5));
        Assert.Equal("-0.25", NumberFormat.Fixed(2).Format(-0.25));
        Assert.Equal("1.23E-05", NumberFormat.Significant(3).Format(1.2345e-5));
    }

    [Fact]
    public void Digit_counts_outside_the_supported_range_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => NumberFormat.Significant(0));
        Assert.Throws<ArgumentOutOfRangeException>(() => NumberFormat.Fixed(-1));
    }
}
