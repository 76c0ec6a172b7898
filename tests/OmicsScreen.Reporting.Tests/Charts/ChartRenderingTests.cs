using System.Xml.Linq;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Charts;

public class ChartRenderingTests
{
    private static readonly XNamespace Svg = "http://www.w3.org/2000/svg";

    [Fact]
    public void Same_input_gives_byte_identical_svg_whatever_the_current_culture()
    {
        var first = SampleReport.Charts().Select(chart => chart.Markup).ToList();
        var second = SampleReport.Charts().Select(chart => chart.Markup).ToList();
        Assert.Equal(first, second);
        using var _ = CultureScope.CommaDecimal();
        Assert.Equal(first, SampleReport.Charts().Select(chart => chart.Markup).ToList());
    }

    [Fact]
    public void Every_chart_parses_as_svg_with_a_title_an_accessible_name_and_a_description()
    {
        foreach (var chart in SampleReport.Charts())
        {
            var root = Markup.Parse(chart.Markup).Root!;
            Assert.Equal(Svg + "svg", root.Name);
            Assert.Equal("img", (string?)root.Attribute("role"));
            Assert.Equal(chart.Title, (string?)root.Attribute("aria-label"));
            Assert.Equal(chart.Title, root.Element(Svg + "title")!.Value);
            Assert.False(string.IsNullOrWhiteSpace(root.Element(Svg + "desc")!.Value));
        }
    }

    [Fact]
    public void Every_chart_draws_its_axis_labels()
    {
        var texts = SampleReport.Charts().SelectMany(chart => Markup.Texts(Markup.Parse(chart.Markup), "text")).ToHashSet();
        foreach (var label in SampleReport.AxisLabels) Assert.Contains(label, texts);
    }

    [Fact]
    public void Untrusted_names_appear_as_escaped_text_and_never_as_elements()
    {
        foreach (var chart in SampleReport.Charts())
        {
            var document = Markup.Parse(chart.Markup);
            Assert.Empty(Markup.Elements(document, "script"));
            Assert.DoesNotContain("<script", chart.Markup, StringComparison.OrdinalIgnoreCase);
            Assert.DoesNotContain(document.Descendants().SelectMany(element => element.Attributes()),
                attribute => attribute.Name.LocalName.StartsWith("on", StringComparison.OrdinalIgnoreCase) || attribute.Name.LocalName == "href");
        }
        var importance = Markup.Texts(Markup.Parse(SampleReport.Charts()[0].Markup), "text");
        Assert.Contains(SampleReport.Script, importance);
        Assert.Contains(SampleReport.NonAscii, importance);
        Assert.Contains(SampleReport.Quotes, importance);
    }

    [Fact]
    public void Line_chart_has_a_legend_entry_per_series_band_reference_line_and_marker()
    {
        var panelSize = Markup.Texts(Markup.Parse(SampleReport.Charts()[3].Markup), "text");
        Assert.Contains("Selection-aware (outer resamples)", panelSize);
        Assert.Contains("Selection-aware (outer resamples) (spread)", panelSize);
        Assert.Contains("Optimistic (same data)", panelSize);
        Assert.Contains("Recommended: 3 markers", panelSize);
        var frequency = Markup.Texts(Markup.Parse(SampleReport.Charts()[1].Markup), "text");
        Assert.Contains("Selection threshold 0.6", frequency);
    }

    [Fact]
    public void Points_that_a_log_axis_cannot_show_break_the_line_instead_of_failing()
    {
        var chart = XYChart.Render(new XYChartOptions("t", "x", "y", YScale: AxisScaleKind.Log10),
            [new XYSeries("s", [1.0, 2, 3, 4, 5], [1.0, 10, 0, 100, double.NaN])]);
        var lines = Markup.Elements(Markup.Parse(chart.Markup), "polyline").ToList();
        Assert.Single(lines); // 1 and 10 joined; 100 stands alone; 0 and NaN skipped
    }

    [Fact]
    public void Mismatched_series_lengths_are_refused()
    {
        Assert.Throws<ArgumentException>(() => XYChart.Render(new XYChartOptions("t", "x", "y"), [new XYSeries("s", [1.0, 2], [1.0])]));
        Assert.Throws<ArgumentException>(() => HeatMapChart.Render(new HeatMapOptions("t", "r"), ["a"], ["a", "b"], new double[1, 1]));
    }

    [Fact]
    public void Long_names_are_shortened_with_the_full_name_kept_as_a_tooltip()
    {
        string longName = new string('x', 80);
        var chart = DotIntervalChart.Render(new DotIntervalChartOptions("t", "v", "Feature"), [new DotIntervalItem(longName, 1, 0, 2)]);
        var document = Markup.Parse(chart.Markup);
        var label = Markup.Elements(document, "text").Single(text => text.Elements().Any());
        Assert.Equal(longName, label.Elements().Single().Value);
        string shown = string.Concat(label.Nodes().OfType<System.Xml.Linq.XText>().Select(text => text.Value));
        Assert.EndsWith("\u2026", shown);
        Assert.True(shown.Length < longName.Length);
    }

    [Fact]
    public void Heat_map_prints_values_and_marks_cells_without_one()
    {
        var texts = Markup.Texts(Markup.Parse(SampleReport.Charts()[5].Markup), "text");
        Assert.Contains("0.62", texts);
        Assert.Contains("-0.30", texts);
        Assert.Contains("NA", texts);
        Assert.Contains("no value", texts);
    }

    [Fact]
    public void Forest_plot_prints_each_estimate_with_its_interval_and_the_pooled_row()
    {
        var texts = Markup.Texts(Markup.Parse(SampleReport.Charts()[6].Markup), "text");
        Assert.Contains("0.81 [0.72, 0.90]", texts);
        Assert.Contains("0.79 [0.71, 0.86]", texts);
        Assert.Contains("Pooled (random effects)", texts);
    }
}
