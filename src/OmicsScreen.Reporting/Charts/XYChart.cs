namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// Scatter and line chart with optional spread bands, reference lines and highlighted points:
/// selection frequency against rank with the threshold line, out-of-bag error against the number
/// of trees, and the panel-size curve (selection-aware and optimistic lines with spread bands, a marker on
/// the recommended size).
/// </summary>
/// <remarks>
/// Series are told apart by colour (Okabe-Ito) and, where the caller chooses, by dashing, so the
/// chart still reads in grey print.
/// </remarks>
public static class XYChart
{
    private const double BandOpacity = 0.2;

    public static SvgImage Render(XYChartOptions options, IReadOnlyList<XYSeries> series,
        IReadOnlyList<ReferenceLine>? referenceLines = null, IReadOnlyList<PointMarker>? markers = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(series);
        referenceLines ??= [];
        markers ??= [];
        foreach (var item in series) Validate(item);

        var xScale = XRange(options, series, referenceLines, markers).Scale(options.XScale);
        var yScale = YAxis(options, series, referenceLines, markers);

        var legend = Legend(series, referenceLines, markers);
        double legendHeight = LegendPainter.Height(legend, options.Width - 40);
        double left = AxisPainter.LeftAxisWidth(yScale) + 10;
        double top = 34 + legendHeight + 8;
        var area = new PlotArea(left, top, options.Width - left - 24, options.Height - top - AxisPainter.BottomAxisHeight - 8);
        if (area.Height < 40) throw new ArgumentException("The chart is too short for its legend; raise Height.", nameof(options));

        string description = options.Description ?? Describe(options, series, referenceLines, markers);
        var svg = new SvgWriter(options.Width, options.Height, options.Title, description);
        AxisPainter.Title(svg, options.Width, options.Title);
        LegendPainter.Draw(svg, legend, 20, 34, options.Width - 40);
        AxisPainter.Left(svg, yScale, area, options.YAxisLabel);
        AxisPainter.Bottom(svg, xScale, area, options.XAxisLabel);

        for (int s = 0; s < series.Count; s++)
            if (series[s].BandLow is not null) DrawBand(svg, series[s], ChartPalette.SeriesColour(s), xScale, yScale, area);
        for (int s = 0; s < series.Count; s++) DrawSeries(svg, series[s], ChartPalette.SeriesColour(s), xScale, yScale, area);
        foreach (var line in referenceLines) DrawReferenceLine(svg, line, xScale, yScale, area);
        foreach (var marker in markers) DrawMarker(svg, marker, xScale, yScale, area);
        return svg.Finish();
    }

    private static void Validate(XYSeries series)
    {
        if (series.X.Count != series.Y.Count) throw new ArgumentException($"Series '{series.Name}' has {series.X.Count} x and {series.Y.Count} y values.");
        if ((series.BandLow is null) != (series.BandHigh is null)) throw new ArgumentException($"Series '{series.Name}' needs both band ends or neither.");
        if (series.BandLow is not null && (series.BandLow.Count != series.X.Count || series.BandHigh!.Count != series.X.Count))
            throw new ArgumentException($"Series '{series.Name}' needs one band value per point.");
    }

    private static DataRange XRange(XYChartOptions options, IReadOnlyList<XYSeries> series,
        IReadOnlyList<ReferenceLine> referenceLines, IReadOnlyList<PointMarker> markers)
    {
        bool positiveOnly = options.XScale == AxisScaleKind.Log10;
        var range = new DataRange();
        foreach (var item in series) range.Include(item.X, positiveOnly);
        foreach (var line in referenceLines)
            if (line.Axis == ChartAxis.X) range.Include(line.Value, positiveOnly);
        foreach (var marker in markers) range.Include(marker.X, positiveOnly);
        return range;
    }

    private static IAxisScale YAxis(XYChartOptions options, IReadOnlyList<XYSeries> series,
        IReadOnlyList<ReferenceLine> referenceLines, IReadOnlyList<PointMarker> markers)
    {
        bool log = options.YScale == AxisScaleKind.Log10;
        if (!log && double.IsFinite(options.YMinimum) && double.IsFinite(options.YMaximum))
            return LinearScale.Fixed(options.YMinimum, options.YMaximum);
        var range = new DataRange();
        foreach (var item in series)
        {
            range.Include(item.Y, log);
            range.Include(item.BandLow, log);
            range.Include(item.BandHigh, log);
        }
        foreach (var line in referenceLines)
            if (line.Axis == ChartAxis.Y) range.Include(line.Value, log);
        foreach (var marker in markers) range.Include(marker.Y, log);
        range.Include(options.YMinimum, log);
        range.Include(options.YMaximum, log);
        return range.Scale(options.YScale);
    }

    private static List<LegendEntry> Legend(IReadOnlyList<XYSeries> series, IReadOnlyList<ReferenceLine> referenceLines,
        IReadOnlyList<PointMarker> markers)
    {
        var entries = new List<LegendEntry>();
        for (int s = 0; s < series.Count; s++)
        {
            var item = series[s];
            string colour = ChartPalette.SeriesColour(s);
            var symbol = item.Style switch
            {
                XYSeriesStyle.Points => LegendSymbol.Dot,
                XYSeriesStyle.DashedLine => LegendSymbol.DashedLine,
                _ => LegendSymbol.Line,
            };
            entries.Add(new LegendEntry(item.Name, colour, symbol));
            if (item.BandLow is not null) entries.Add(new LegendEntry(item.Name + " (spread)", colour, LegendSymbol.Band));
        }
        foreach (var line in referenceLines) entries.Add(new LegendEntry(line.Label, ChartPalette.Axis, LegendSymbol.DashedLine));
        foreach (var marker in markers) entries.Add(new LegendEntry(marker.Label, ChartPalette.Black, LegendSymbol.Diamond));
        return entries;
    }

    private static void DrawBand(SvgWriter svg, XYSeries series, string colour, IAxisScale xScale, IAxisScale yScale, PlotArea area)
    {
        // Each run of consecutive drawable points becomes one polygon: the upper edge left to right, then the lower edge back.
        var upperX = new List<double>();
        var upperY = new List<double>();
        var lowerY = new List<double>();
        svg.BeginGroup(series.Name + " (spread)");
        for (int i = 0; i <= series.X.Count; i++)
        {
            bool drawable = i < series.X.Count && xScale.CanShow(series.X[i])
                && yScale.CanShow(series.BandLow![i]) && yScale.CanShow(series.BandHigh![i]);
            if (drawable)
            {
                upperX.Add(area.X(xScale, series.X[i]));
                upperY.Add(area.ClampedY(yScale, series.BandHigh![i]));
                lowerY.Add(area.ClampedY(yScale, series.BandLow![i]));
                continue;
            }
            if (upperX.Count >= 2)
            {
                int count = upperX.Count;
                var xs = new double[2 * count];
                var ys = new double[2 * count];
                for (int k = 0; k < count; k++)
                {
                    xs[k] = upperX[k];
                    ys[k] = upperY[k];
                    xs[2 * count - 1 - k] = upperX[k];
                    ys[2 * count - 1 - k] = lowerY[k];
                }
                svg.Polygon(xs, ys, colour, BandOpacity);
            }
            upperX.Clear();
            upperY.Clear();
            lowerY.Clear();
        }
        svg.EndGroup();
    }

    private static void DrawSeries(SvgWriter svg, XYSeries series, string colour, IAxisScale xScale, IAxisScale yScale, PlotArea area)
    {
        svg.BeginGroup(series.Name);
        bool drawLine = series.Style != XYSeriesStyle.Points;
        bool drawPoints = series.Style is XYSeriesStyle.Points or XYSeriesStyle.LineAndPoints;
        string? dash = series.Style == XYSeriesStyle.DashedLine ? LegendPainter.SeriesDash : null;
        var runX = new List<double>();
        var runY = new List<double>();
        for (int i = 0; i <= series.X.Count; i++)
        {
            bool drawable = i < series.X.Count && xScale.CanShow(series.X[i]) && yScale.CanShow(series.Y[i]);
            if (drawable)
            {
                runX.Add(area.X(xScale, series.X[i]));
                runY.Add(area.ClampedY(yScale, series.Y[i]));
                continue;
            }
            if (drawLine && runX.Count >= 2) svg.Polyline(runX.ToArray(), runY.ToArray(), colour, 2, dash);
            if (drawPoints)
                for (int k = 0; k < runX.Count; k++) svg.Circle(runX[k], runY[k], 3.5, colour, ChartPalette.Black, 0.5, 0.85);
            runX.Clear();
            runY.Clear();
        }
        svg.EndGroup();
    }

    private static void DrawReferenceLine(SvgWriter svg, ReferenceLine line, IAxisScale xScale, IAxisScale yScale, PlotArea area)
    {
        const int maxLabelCharacters = 48;
        string label = ChartText.Shorten(line.Label, maxLabelCharacters);
        if (line.Axis == ChartAxis.Y)
        {
            if (!yScale.CanShow(line.Value)) return;
            AxisPainter.HorizontalReference(svg, yScale, area, line.Value);
            svg.Text(area.Right - 4, area.ClampedY(yScale, line.Value) - 5, label, TextAnchor.End, 11, fill: ChartPalette.Axis, tooltip: line.Label);
        }
        else
        {
            if (!xScale.CanShow(line.Value)) return;
            AxisPainter.VerticalReference(svg, xScale, area, line.Value);
            svg.Text(area.ClampedX(xScale, line.Value) + 4, area.Top + 12, label, TextAnchor.Start, 11, fill: ChartPalette.Axis, tooltip: line.Label);
        }
    }

    private static void DrawMarker(SvgWriter svg, PointMarker marker, IAxisScale xScale, IAxisScale yScale, PlotArea area)
    {
        if (!xScale.CanShow(marker.X) || !yScale.CanShow(marker.Y)) return;
        double x = area.X(xScale, marker.X), y = area.ClampedY(yScale, marker.Y);
        svg.Polygon([x - 7, x, x + 7, x], [y, y - 7, y, y + 7], ChartPalette.Black, 1, "#ffffff");
        svg.Text(x, y - 11, ChartText.Shorten(marker.Label, 40), TextAnchor.Middle, 11, bold: true, tooltip: marker.Label);
    }

    private static string Describe(XYChartOptions options, IReadOnlyList<XYSeries> series,
        IReadOnlyList<ReferenceLine> referenceLines, IReadOnlyList<PointMarker> markers)
    {
        var names = new List<string>(series.Count);
        foreach (var item in series) names.Add(item.Name);
        string text = $"Chart of {options.YAxisLabel} against {options.XAxisLabel}; series: {string.Join(", ", names)}.";
        foreach (var line in referenceLines) text += $" Reference line: {line.Label}.";
        foreach (var marker in markers) text += $" Marked point: {marker.Label}.";
        return text;
    }
}
