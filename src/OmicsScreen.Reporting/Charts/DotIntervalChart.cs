using System.Globalization;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// Horizontal dot (or bar) chart with interval bars, one row per item in the given order: the
/// importance of the top features with their spread across repeats.
/// </summary>
public static class DotIntervalChart
{
    private const double RowHeight = 22;
    private const int MaxLabelCharacters = 36;

    public static SvgImage Render(DotIntervalChartOptions options, IReadOnlyList<DotIntervalItem> items)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(items);
        var range = new DataRange();
        foreach (var item in items)
        {
            range.Include(item.Value);
            range.Include(item.Low);
            range.Include(item.High);
        }
        range.Include(options.ReferenceValue);
        if (options.DrawBars) range.Include(BarBase(options));
        var scale = range.Scale(AxisScaleKind.Linear);

        double labelWidth = 0;
        foreach (var item in items) labelWidth = Math.Max(labelWidth, ChartText.EstimateWidth(ChartText.Shorten(item.Label, MaxLabelCharacters)));
        double left = labelWidth + 40;
        var legend = options.LegendText is null
            ? []
            : new[] { new LegendEntry(options.LegendText, ChartPalette.Blue, LegendSymbol.Dot) };
        double legendHeight = LegendPainter.Height(legend, options.Width - left - 20);
        double top = 34 + legendHeight + 6;
        double plotHeight = Math.Max(1, items.Count) * RowHeight;
        int height = (int)Math.Ceiling(top + plotHeight + AxisPainter.BottomAxisHeight + 8);
        var area = new PlotArea(left, top, options.Width - left - 24, plotHeight);

        string description = options.Description
            ?? string.Create(CultureInfo.InvariantCulture, $"Horizontal dot chart of {items.Count} {options.ItemAxisLabel.ToLowerInvariant()} values with interval bars, on the axis {options.ValueAxisLabel}.");
        var svg = new SvgWriter(options.Width, height, options.Title, description);
        AxisPainter.Title(svg, options.Width, options.Title);
        LegendPainter.Draw(svg, legend, left, 34, options.Width - left - 20);
        AxisPainter.Bottom(svg, scale, area, options.ValueAxisLabel);
        svg.Text(14, area.Top + area.Height / 2, options.ItemAxisLabel, TextAnchor.Middle, bold: true, rotateDegrees: -90);

        AxisPainter.VerticalReference(svg, scale, area, options.ReferenceValue);

        svg.BeginGroup("rows");
        for (int i = 0; i < items.Count; i++)
        {
            var item = items[i];
            double y = area.Top + (i + 0.5) * RowHeight;
            svg.Text(area.Left - 8, y + 4, ChartText.Shorten(item.Label, MaxLabelCharacters), TextAnchor.End, tooltip: item.Label);
            if (options.DrawBars && double.IsFinite(item.Value))
            {
                double from = area.X(scale, BarBase(options)), to = area.X(scale, item.Value);
                svg.Rect(Math.Min(from, to), y - RowHeight * 0.32, Math.Abs(to - from), RowHeight * 0.64, ChartPalette.SkyBlue, opacity: 0.45);
            }
            if (double.IsFinite(item.Low) && double.IsFinite(item.High))
            {
                double x1 = area.X(scale, item.Low), x2 = area.X(scale, item.High);
                svg.Line(x1, y, x2, y, ChartPalette.Black, 1.5);
                svg.Line(x1, y - 5, x1, y + 5, ChartPalette.Black, 1.5);
                svg.Line(x2, y - 5, x2, y + 5, ChartPalette.Black, 1.5);
            }
            if (double.IsFinite(item.Value)) svg.Circle(area.X(scale, item.Value), y, 4.5, ChartPalette.Blue, ChartPalette.Black, 0.75);
        }
        svg.EndGroup();
        return svg.Finish();
    }

    private static double BarBase(DotIntervalChartOptions options) =>
        double.IsFinite(options.ReferenceValue) ? options.ReferenceValue : 0;
}
