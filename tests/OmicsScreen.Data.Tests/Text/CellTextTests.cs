using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Text;

public class CellTextTests
{
    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    [InlineData("NA")]
    [InlineData("na")]
    [InlineData("NaN")]
    [InlineData("nan")]
    [InlineData("N/A")]
    [InlineData("n/a")]
    [InlineData("null")]
    [InlineData("NULL")]
    [InlineData(" NA ")]
    public void Missing_tokens_are_missing_whatever_their_case(string text)
    {
        Assert.Equal(CellKind.Missing, CellText.Classify(text, out float value));
        Assert.True(float.IsNaN(value));
    }

    [Theory]
    [InlineData("<LOD")]
    [InlineData("<lod")]
    [InlineData("<LLOQ")]
    [InlineData("<LOQ")]
    [InlineData("BLQ")]
    [InlineData("blod")]
    [InlineData(" < LOD ")]
    public void Below_detection_tokens_without_a_limit_are_censored_with_no_value(string text)
    {
        Assert.Equal(CellKind.BelowDetection, CellText.Classify(text, out float value));
        Assert.True(float.IsNaN(value));
    }

    [Theory]
    [InlineData("<0.05", 0.05f)]
    [InlineData("< 1e-3", 1e-3f)]
    [InlineData("<12", 12f)]
    public void Below_a_stated_limit_keeps_the_limit_as_the_value(string text, float limit)
    {
        Assert.Equal(CellKind.BelowDetection, CellText.Classify(text, out float value));
        Assert.Equal(limit, value);
    }

    [Theory]
    [InlineData("17.99", 17.99f)]
    [InlineData("-0.5", -0.5f)]
    [InlineData("+3", 3f)]
    [InlineData(".25", 0.25f)]
    [InlineData("1e-3", 1e-3f)]
    [InlineData("2.5E+2", 250f)]
    [InlineData(" 42 ", 42f)]
    [InlineData("3.4028235E+38", float.MaxValue)]
    public void Numbers_parse_in_the_invariant_culture(string text, float expected)
    {
        Assert.Equal(CellKind.Measured, CellText.Classify(text, out float value));
        Assert.Equal(expected, value);
    }

    [Theory]
    [InlineData("Infinity")]
    [InlineData("-inf")]
    [InlineData("+Infinity")]
    [InlineData("1e400")]
    [InlineData("-1e39")]
    [InlineData("∞")]
    public void Infinity_and_numbers_beyond_float_range_are_infinite(string text) =>
        Assert.Equal(CellKind.Infinite, CellText.Classify(text, out _));

    [Theory]
    [InlineData("high")]
    [InlineData("1,5")]
    [InlineData("1.2.3")]
    [InlineData("12abc")]
    [InlineData("<abc")]
    [InlineData(">10")]
    [InlineData("1 000")]
    public void Other_text_is_not_a_number(string text) =>
        Assert.Equal(CellKind.NotANumber, CellText.Classify(text, out _));

    [Fact]
    public void Formatted_cells_read_back_to_the_same_state_and_bits()
    {
        float[] values = [0.1f, -1.17549435e-38f, float.MaxValue, 1f / 3f, 123456.78f, float.Epsilon];
        foreach (float v in values)
        {
            Assert.Equal(CellKind.Measured, CellText.Classify(CellText.Format(CellState.Measured, v), out float back));
            Assert.Equal(BitConverter.SingleToInt32Bits(v), BitConverter.SingleToInt32Bits(back));
            Assert.Equal(CellKind.BelowDetection, CellText.Classify(CellText.Format(CellState.BelowDetection, Math.Abs(v)), out back));
            Assert.Equal(Math.Abs(v), back);
        }
        Assert.Equal(CellKind.Missing, CellText.Classify(CellText.Format(CellState.Missing, float.NaN), out _));
        Assert.Equal(CellKind.BelowDetection, CellText.Classify(CellText.Format(CellState.BelowDetection, float.NaN), out float none));
        Assert.True(float.IsNaN(none));
    }
}
