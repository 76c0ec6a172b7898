using System.Globalization;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Tests.Screen;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Charts;

/// <summary>
/// Issue 14's figure fixes: the panel-size curve on a log-spaced axis with a chance line and the
/// locked size; one number form per axis; below-detection values with an unknown limit drawn apart
/// from the value axis.
/// </summary>
public sealed class ReportFigureTests
{
    [Fact]
    public void The_panel_size_curve_has_a_log_axis_a_chance_line_and_the_locked_size()
    {
        var result = ScreenReportSample.Result;
        var curve = result.PanelSize!;
        var chart = ScreenReportCharts.PanelSize(curve, ScreenReportSample.Panel, lockedPanelSize: 3);
        var texts = Markup.Texts(Markup.Parse(chart.Markup), "text");

        Assert.Contains(OutcomeKindReport.ChanceLabel(curve), texts);
        Assert.Contains("Locked panel: 3 markers", texts);
        // Log-spaced ticks: 1, 2, 5, 10 (sizes 1 to 6 span one decade, so the 2x and 5x ticks are added).
        foreach (var tick in new[] { "1", "2", "5", "10" }) Assert.Contains(tick, texts);
        // The y axis reaches down to chance, so the curve is read against it: some tick is at or below 0.5.
        Assert.Contains(texts, t => double.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out double tick) && tick <= 0.5);
    }

    [Fact]
    public void The_locked_panels_roc_curve_runs_from_the_origin_to_the_corner_through_hand_worked_points()
    {
        // Hand-worked: scores 0.9 (positive), 0.8 (negative), 0.7 (positive), 0.2 (negative):
        // thresholds give (FPR, TPR) = (0, 0), (0, 0.5), (0.5, 0.5), (0.5, 1), (1, 1) (common practice).
        var curve = ScreenReportSample.Result.PanelSize! with
        {
            LockedOutOfFoldScores = [0.9, 0.8, 0.7, 0.2],
            LockedOutOfFoldPositive = [true, false, true, false],
            LockedEstimate = 0.75,
        };
        var chart = ScreenReportCharts.LockedPanelRoc(curve);
        var texts = Markup.Texts(Markup.Parse(chart.Markup), "text");
        Assert.Contains("Held-out samples (AUC 0.750)", texts);
        Assert.Contains("False positive rate (1 - specificity)", texts);
        Assert.Contains("<polyline", chart.Markup);
    }

    [Fact]
    public void Chance_is_half_for_AUC_and_C_zero_for_R_squared_and_the_largest_class_share_for_accuracy()
    {
        // AUC and Harrell's C of a constant score are 0.5; R² of predicting the test mean is 0 (its
        // definition, as in scikit-learn's r2_score); always calling the largest class is right for its share.
        var panel = ScreenReportSample.Panel;
        var outcome = panel.Outcome;
        var curve = ScreenReportSample.Result.PanelSize!;
        Assert.Equal(0.5, OutcomeKindReport.ChanceLevel(curve with { Metric = "auc" }, panel));
        Assert.Equal(0.5, OutcomeKindReport.ChanceLevel(curve with { Metric = "concordance" }, panel));
        Assert.Equal(0.0, OutcomeKindReport.ChanceLevel(curve with { Metric = "r_squared" }, panel));
        double largest = (double)outcome.ClassCounts.ToArray().Max() / outcome.SampleCount;
        Assert.Equal(largest, OutcomeKindReport.ChanceLevel(curve with { Metric = "accuracy" }, panel));
    }

    [Theory]
    [InlineData(2000, 1_000_000)]
    [InlineData(1e-4, 0.5)]
    [InlineData(10, 5000)]
    public void An_axis_never_mixes_plain_and_exponent_numbers(double minimum, double maximum)
    {
        foreach (var scale in new IAxisScale[] { LinearScale.Nice(minimum, maximum), LogScale.Create(minimum, maximum) })
        {
            var labels = scale.Ticks.Select(t => t.Label).ToList();
            int exponent = labels.Count(l => l.Contains('e', StringComparison.Ordinal));
            Assert.True(exponent == 0 || exponent == labels.Count(l => l != "0"), string.Join(", ", labels));
        }
    }

    [Fact]
    public void Below_detection_with_an_unknown_limit_sits_on_a_row_under_the_axis()
    {
        var chart = StripBoxChart.Render(new StripBoxChartOptions("F", "Intensity", ValueScale: AxisScaleKind.Log10),
            [new StripGroup("case", [50.0, 60, 70], 2), new StripGroup("control", [30.0, 40], 1)]);
        var document = Markup.Parse(chart.Markup);
        Assert.Contains("below detection (limit unknown)", Markup.Texts(document, "text"));
        var hollow = Markup.Elements(document, "circle").Where(c => (string?)c.Attribute("fill") == "none").Skip(1).ToList();
        var filled = Markup.Elements(document, "circle").Where(c => (string?)c.Attribute("fill") != "none").ToList();
        Assert.Equal(3, hollow.Count);
        double rowY = double.Parse((string)hollow[0].Attribute("cy")!, CultureInfo.InvariantCulture);
        double lowestMeasured = filled.Skip(1).Max(c => double.Parse((string)c.Attribute("cy")!, CultureInfo.InvariantCulture));
        Assert.True(rowY > lowestMeasured + 10, "the below-detection row should sit apart, under every measured value");
        // The axis is not stretched: it starts at the decade of the smallest measured value.
        Assert.Contains("10", Markup.Texts(document, "text"));
        Assert.DoesNotContain("1", Markup.Texts(document, "text"));
    }
}
