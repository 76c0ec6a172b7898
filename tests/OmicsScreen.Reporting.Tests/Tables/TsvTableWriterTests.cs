using System.Globalization;
using OmicsScreen.Reporting.Tables;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Tables;

public class TsvTableWriterTests
{
    private sealed record Row(string Name, double Score, long Count);

    private static readonly TsvTableWriter<Row> Writer = new(
    [
        TsvColumn<Row>.Text("feature", row => row.Name),
        TsvColumn<Row>.Number("score", row => row.Score, NumberFormat.RoundTrip),
        TsvColumn<Row>.Integer("count", row => row.Count),
    ]);

    private static string[] Lines(string text)
    {
        Assert.EndsWith("\n", text);
        return text[..^1].Split('\n');
    }

    private static string Write(params Row[] rows)
    {
        var writer = new StringWriter();
        Assert.Equal(rows.Length, Writer.Write(writer, rows));
        return writer.ToString();
    }

    [Fact]
    public void Writes_a_header_then_one_line_per_record()
    {
        var lines = Lines(Write(new Row("ALB", 0.5, 3), new Row("IL-6", 2, 10)));
        Assert.Equal(["feature\tscore\tcount", "ALB\t0.5\t3", "IL-6\t2\t10"], lines);
    }

    // OWASP CSV injection guidance: text cells that look like formulas are neutralised; numbers are data and stay as written.
    [Fact]
    public void Formula_names_are_neutralised_but_negative_numbers_stay()
    {
        var lines = Lines(Write(new Row("=cmd()", -0.5, -3), new Row("+1", -1e-7, 0), new Row("-x", 0, 0), new Row("@SUM(A1)", 0, 0)));
        Assert.Equal("'=cmd()\t-0.5\t-3", lines[1]);
        Assert.Equal("'+1\t-1E-07\t0", lines[2]);
        Assert.StartsWith("'-x\t", lines[3]);
        Assert.StartsWith("'@SUM(A1)\t", lines[4]);
    }

    [Fact]
    public void Tabs_and_line_breaks_in_names_cannot_break_rows()
    {
        var lines = Lines(Write(new Row("a\tb", 1, 1), new Row("line\nbreak\r\nhere", 2, 2), new Row("sep\u2028x", 3, 3)));
        Assert.Equal(4, lines.Length);
        foreach (var line in lines) Assert.Equal(3, line.Split('\t').Length);
        Assert.Equal("a b", lines[1].Split('\t')[0]);
        Assert.Equal("line break  here", lines[2].Split('\t')[0]);
    }

    [Fact]
    public void Missing_numbers_are_written_as_NA()
    {
        Assert.Equal("x\tNA\t1", Lines(Write(new Row("x", double.NaN, 1)))[1]);
    }

    [Fact]
    public void Output_is_invariant_under_a_comma_decimal_current_culture()
    {
        string expected = Write(new Row("x", -1234.5678, -12345), new Row("y", 1e-20, 0));
        using var _ = CultureScope.CommaDecimal();
        Assert.Equal("-1234,5678", (-1234.5678).ToString(CultureInfo.CurrentCulture).Replace('\u2212', '-'));
        Assert.Equal(expected, Write(new Row("x", -1234.5678, -12345), new Row("y", 1e-20, 0)));
        Assert.Contains("x\t-1234.5678\t-12345", expected);
    }

    [Fact]
    public void Headers_from_data_are_sanitised_and_must_be_unique()
    {
        var writer = new TsvTableWriter<Row>([TsvColumn<Row>.Text("=evil\tname", row => row.Name)]);
        var text = new StringWriter();
        writer.Write(text, [new Row("a", 0, 0)]);
        Assert.Equal("'=evil name\na\n", text.ToString());
        Assert.Throws<ArgumentException>(() => new TsvTableWriter<Row>(
            [TsvColumn<Row>.Text("feature", row => row.Name), TsvColumn<Row>.Text("feature", row => row.Name)]));
    }
}
