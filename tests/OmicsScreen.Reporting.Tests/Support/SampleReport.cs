using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Html;

namespace OmicsScreen.Reporting.Tests.Support;

/// <summary>
/// A report built from every building block, with hostile and non-ASCII names, for the HTML and
/// browser tests. The numbers are made up for layout only.
/// </summary>
internal static class SampleReport
{
    public const string Script = "<script>alert(1)</script>";
    public const string Ampersand = "&amp;";
    public const string Quotes = "say \"hi\" & 'bye'";
    public const string Formula = "=cmd()";
    public const string NonAscii = "\u00C5ngstr\u00F6m-\u03B2";

    public static readonly string[] FeatureNames = [Script, NonAscii, Formula, Quotes, "IL-6", Ampersand];

    public static readonly string[] AxisLabels =
    [
        "Permutation importance (AUC drop)", "Feature", "Rank", "Selection frequency",
        "Number of trees", "Out-of-bag error (fraction)", "Panel size (markers)", "Cross-validated AUC",
        "Intensity (log2 units)", "Class", "Spearman correlation", "AUC (95% CI)", "Cohort",
    ];

    public static readonly string[] TableFeatureCells = FeatureNames;

    public static IReadOnlyList<SvgImage> Charts()
    {
        var importance = DotIntervalChart.Render(
            new DotIntervalChartOptions("Top features by importance", AxisLabels[0], AxisLabels[1], ReferenceValue: 0, DrawBars: true,
                LegendText: "Median across repeats; whiskers: 10th to 90th percentile"),
            [
                new DotIntervalItem(Script, 0.12, 0.08, 0.16),
                new DotIntervalItem(NonAscii, 0.09, 0.05, 0.11),
                new DotIntervalItem(Formula, 0.04, -0.01, 0.07),
                new DotIntervalItem(Quotes, 0.01, -0.02, 0.03),
            ]);
        var frequency = XYChart.Render(
            new XYChartOptions("Selection frequency by rank", AxisLabels[2], AxisLabels[3], YMinimum: 0, YMaximum: 1),
            [new XYSeries("Selection frequency", [1.0, 2, 3, 4, 5, 6], [0.98, 0.95, 0.7, 0.4, 0.2, 0.1], XYSeriesStyle.LineAndPoints)],
            [new ReferenceLine(ChartAxis.Y, 0.6, "Selection threshold 0.6")]);
        var outOfBag = XYChart.Render(
            new XYChartOptions("Out-of-bag error as trees are added", AxisLabels[4], AxisLabels[5], XScale: AxisScaleKind.Log10),
            [new XYSeries("Out-of-bag error", [10.0, 30, 100, 300, 1000], [0.2, 0.15, 0.12, 0.11, 0.105])]);
        var panelSize = XYChart.Render(
            new XYChartOptions("Panel-size curve", AxisLabels[6], AxisLabels[7], YMinimum: 0.5, YMaximum: 1),
            [
                new XYSeries("Selection-aware (outer resamples)", [1.0, 2, 3, 5, 8], [0.7, 0.78, 0.82, 0.83, 0.83], XYSeriesStyle.LineAndPoints,
                    [0.64, 0.72, 0.77, 0.78, 0.77], [0.76, 0.84, 0.87, 0.88, 0.89]),
                new XYSeries("Optimistic (same data)", [1.0, 2, 3, 5, 8], [0.75, 0.85, 0.9, 0.93, 0.95], XYSeriesStyle.DashedLine),
            ],
            markers: [new PointMarker(3, 0.82, "Recommended: 3 markers")]);
        var strip = StripBoxChart.Render(
            new StripBoxChartOptions(NonAscii, AxisLabels[8], AxisLabels[9], DetectionLimit: 2),
            [
                new StripGroup("case", [5.1, 6.2, 7.0, 6.6, 5.8, 7.4, 6.9], 1),
                new StripGroup("control", [3.1, 4.0, 3.6, 2.8], 3),
            ]);
        var heatMap = HeatMapChart.Render(new HeatMapOptions("Correlation of the shortlist", AxisLabels[10]),
            [Script, NonAscii, Formula], [Script, NonAscii, Formula],
            new double[,] { { 1, 0.62, -0.3 }, { 0.62, 1, double.NaN }, { -0.3, double.NaN, 1 } });
        var forest = ForestPlotChart.Render(new ForestPlotOptions("AUC by cohort", AxisLabels[11], AxisLabels[12], NullValue: 0.5),
            [
                new ForestRow("Cohort A", 0.81, 0.72, 0.9, 40),
                new ForestRow(Script, 0.74, 0.6, 0.88, 15),
            ],
            new ForestRow("Pooled (random effects)", 0.79, 0.71, 0.86));
        return [importance, frequency, outOfBag, panelSize, strip, heatMap, forest];
    }

    public static string Build()
    {
        var html = new HtmlBuilder().BeginDocument("Screening report: " + NonAscii);
        html.Caution("For research use only",
        [
            "This shortlist is a hypothesis for a validation study, not a diagnostic result.",
            "Names from the data are shown as text: " + Script,
        ]);
        html.BeginSection("Run settings").DefinitionList(
        [
            new("Panel file", "panel " + Quotes + ".csv"),
            new("Outcome", Formula),
        ]).EndSection();
        var table = new HtmlTable("Shortlist", [new HtmlTableColumn("Feature"), new HtmlTableColumn("Selection frequency", ColumnAlignment.Numeric)]);
        for (int i = 0; i < TableFeatureCells.Length; i++)
            table.AddRow(TableFeatureCells[i], (0.95 - i * 0.1).ToString("F2", System.Globalization.CultureInfo.InvariantCulture));
        html.BeginSection("Shortlist").Paragraph("Markers chosen in most repeats " + Ampersand).Table(table);
        html.BeginSection("Figures");
        var charts = Charts();
        foreach (var chart in charts) html.Figure(chart, "Figure: " + chart.Title);
        html.EndSection().EndSection();
        return html.EndDocument();
    }
}
