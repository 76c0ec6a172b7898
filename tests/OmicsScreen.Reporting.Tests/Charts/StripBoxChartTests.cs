using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Charts;

public class StripBoxChartTests
{
    // Quartiles by Hyndman & Fan (1996) type 7, whiskers at 1.5 IQR (Tukey 1977); worked by hand.
    [Fact]
    public void Box_summary_of_one_to_nine_has_quartiles_three_and_seven()
    {
        var box = BoxSummary.OfSorted([1.0, 2, 3, 4, 5, 6, 7, 8, 9]);
        Assert.Equal(new BoxSummary(1, 3, 5, 7, 9), box);
    }

    [Fact]
    public void Whiskers_stop_at_the_last_value_inside_the_fence()
    {
        // Q1 = 2, Q3 = 4, IQR = 2: the upper fence is 7, so 100 is outside and the whisker ends at 4.
        var box = BoxSummary.OfSorted([1.0, 2, 3, 4, 100]);
        Assert.Equal(new BoxSummary(1, 2, 3, 4, 4), box);
    }

    [Fact]
    public void Below_detection_samples_are_hollow_markers_on_the_labelled_limit_row()
    {
        var chart = StripBoxChart.Render(new StripBoxChartOptions("F", "Intensity", DetectionLimit: 2),
            [new StripGroup("case", [5.0, 6, 7], 1), new StripGroup("control", [3.0, 4], 3)]);
        var document = Markup.Parse(chart.Markup);
        var circles = Markup.Elements(document, "circle").ToList();
        var hollow = circles.Where(circle => (string?)circle.Attribute("fill") == "none").ToList();
        Assert.Equal(4 + 1, hollow.Count); // four samples plus the legend swatch
        var rowY = hollow.Skip(1).Select(circle => (string?)circle.Attribute("cy")).Distinct().ToList();
        Assert.Single(rowY);
        var texts = Markup.Texts(document, "text");
        Assert.Contains("detection limit", texts);
        Assert.Contains("n = 4, 1 below limit", texts);
        Assert.Contains("n = 5, 3 below limit", texts);
    }

    [Fact]
    public void Jitter_is_deterministic_and_stays_within_the_strip()
    {
        for (int i = 0; i < 500; i++)
        {
            double offset = StripBoxChart.Jitter(i);
            Assert.InRange(offset, -0.5, 0.5);
            Assert.Equal(offset, StripBoxChart.Jitter(i));
        }
        Assert.NotEqual(StripBoxChart.Jitter(1), StripBoxChart.Jitter(2));
    }
}
