using System.Globalization;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// Strip chart (every sample as a dot, spread sideways) over a box plot, one group per class, for
/// one feature. Samples below the detection limit are drawn as hollow markers on a labelled row at
/// the limit, so a reader sees how many there are without mistaking them for measured values; when
/// the limit is unknown they get a labelled row of their own under the value axis, apart from it,
/// so they neither pose as values nor stretch the axis.
/// </summary>
/// <remarks>
/// Below-detection samples enter the box statistics at the limit: they are known to be lower than
/// every measured value, so ranks (and hence quartiles) stay right; a box or whisker reaching the
/// limit row says that share of the class is below detection. The sideways spread is
/// deterministic: point k is shifted by (frac(k φ) - 1/2) of the strip width with φ the golden
/// ratio conjugate, a Weyl sequence that spreads points evenly without a random generator (common
/// practice), so the same data always give the same picture.
/// </remarks>
public static class StripBoxChart
{
    private const double GoldenRatioConjugate = 0.6180339887498949;
    private const int MaxGroupNameCharacters = 24;
    private const double LinearRowPadding = 0.05;
    private const double LogRowPadding = 1.3;
    private const double ApartRowHeight = 26;

    public static SvgImage Render(StripBoxChartOptions options, IReadOnlyList<StripGroup> groups)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(groups);
        if (groups.Count == 0) throw new ArgumentException("A strip chart needs at least one group.", nameof(groups));
        bool log = options.ValueScale == AxisScaleKind.Log10;
        var range = new DataRange();
        int censoredTotal = 0;
        foreach (var group in groups)
        {
            range.Include(group.MeasuredValues, log);
            ArgumentOutOfRangeException.ThrowIfNegative(group.BelowDetectionCount);
            censoredTotal += group.BelowDetectionCount;
        }
        if (censoredTotal > 0 && (log ? options.DetectionLimit > 0 : double.IsFinite(options.DetectionLimit)))
        {
            range.Include(options.DetectionLimit, log);
            // Room under the limit row so its hollow markers do not sit on the axis line.
            double span = range.Maximum - range.Minimum;
            range.Include(log ? options.DetectionLimit / LogRowPadding : options.DetectionLimit - LinearRowPadding * span, log);
        }
        var scale = range.Scale(options.ValueScale);
        bool limitKnown = scale.CanShow(options.DetectionLimit);
        bool apart = censoredTotal > 0 && !limitKnown;
        // Box statistics still count them, at the bottom of the axis: below every measured value.
        double limitRow = limitKnown && censoredTotal > 0 ? options.DetectionLimit : scale.Minimum;
        double apartHeight = apart ? ApartRowHeight : 0;

        var legend = new List<LegendEntry> { new("Measured sample", ChartPalette.Axis, LegendSymbol.Dot) };
        if (censoredTotal > 0)
            legend.Add(new(apart ? "Below detection, limit unknown (row under the axis)" : "Below detection (drawn at the limit)",
                ChartPalette.Axis, LegendSymbol.HollowDot));
        legend.Add(new("Median; box: quartiles; whiskers: 1.5 IQR", ChartPalette.Black, LegendSymbol.Line));
        double legendHeight = LegendPainter.Height(legend, options.Width - 40);
        double left = AxisPainter.LeftAxisWidth(scale) + 10;
        double top = 34 + legendHeight + 8;
        const double groupLabelHeight = 18; // second line under the group names: sample counts
        var area = new PlotArea(left, top, options.Width - left - 24,
            options.Height - top - AxisPainter.BottomAxisHeight - groupLabelHeight - apartHeight - 8);
        if (area.Height < 40) throw new ArgumentException("The chart is too short for its legend; raise Height.", nameof(options));

        var svg = new SvgWriter(options.Width, options.Height, options.Title, options.Description ?? Describe(options, groups));
        AxisPainter.Title(svg, options.Width, options.Title);
        LegendPainter.Draw(svg, legend, 20, 34, options.Width - 40);
        AxisPainter.Left(svg, scale, area, options.ValueAxisLabel);
        svg.Line(area.Left, area.Bottom, area.Right, area.Bottom, ChartPalette.Axis);
        svg.Text(area.Left + area.Width / 2, area.Bottom + apartHeight + AxisPainter.BottomAxisHeight + groupLabelHeight - 6,
            options.GroupAxisLabel, TextAnchor.Middle, bold: true);

        if (apart)
        {
            svg.Line(area.Left, area.Bottom + apartHeight, area.Right, area.Bottom + apartHeight, ChartPalette.Axis, 0.75);
            svg.Text(area.Left + 4, area.Bottom + apartHeight - 4, "below detection (limit unknown)", TextAnchor.Start, 11, fill: ChartPalette.Axis);
        }
        else if (censoredTotal > 0)
        {
            double y = area.Y(scale, limitRow);
            string rowLabel = scale.CanShow(options.DetectionLimit) ? "detection limit" : "below detection (limit unknown)";
            AxisPainter.HorizontalReference(svg, scale, area, limitRow);
            svg.Text(area.Left + 4, y - 5, rowLabel, TextAnchor.Start, 11, fill: ChartPalette.Axis);
        }

        double groupWidth = area.Width / groups.Count;
        for (int g = 0; g < groups.Count; g++)
            DrawGroup(svg, groups[g], ChartPalette.SeriesColour(g), area, scale, limitRow, area.Left + (g + 0.5) * groupWidth, groupWidth,
                apart ? area.Bottom + apartHeight / 2 : double.NaN, apartHeight);
        return svg.Finish();
    }

    private static void DrawGroup(SvgWriter svg, StripGroup group, string colour, PlotArea area, IAxisScale scale,
        double limitRow, double centre, double groupWidth, double apartRowY, double apartHeight)
    {
        svg.BeginGroup(group.Name);
        int shown = 0;
        for (int i = 0; i < group.MeasuredValues.Count; i++)
            if (scale.CanShow(group.MeasuredValues[i])) shown++;
        var sorted = new double[shown + group.BelowDetectionCount];
        for (int i = 0; i < group.BelowDetectionCount; i++) sorted[i] = limitRow;
        int next = group.BelowDetectionCount;
        for (int i = 0; i < group.MeasuredValues.Count; i++)
            if (scale.CanShow(group.MeasuredValues[i])) sorted[next++] = group.MeasuredValues[i];
        Array.Sort(sorted);

        if (sorted.Length > 0)
        {
            var box = BoxSummary.OfSorted(sorted);
            double boxWidth = Math.Min(64, groupWidth * 0.4);
            double x0 = centre - boxWidth / 2;
            double lowWhisker = area.Y(scale, box.LowerWhisker), q1 = area.Y(scale, box.LowerQuartile);
            double median = area.Y(scale, box.Median), q3 = area.Y(scale, box.UpperQuartile);
            double highWhisker = area.Y(scale, box.UpperWhisker);
            svg.Line(centre, q1, centre, lowWhisker, ChartPalette.Black, 1.25);
            svg.Line(centre, q3, centre, highWhisker, ChartPalette.Black, 1.25);
            svg.Line(centre - boxWidth / 4, lowWhisker, centre + boxWidth / 4, lowWhisker, ChartPalette.Black, 1.25);
            svg.Line(centre - boxWidth / 4, highWhisker, centre + boxWidth / 4, highWhisker, ChartPalette.Black, 1.25);
            svg.Rect(x0, q3, boxWidth, q1 - q3, colour, ChartPalette.Black, 1.25, 0.18);
            svg.Line(x0, median, x0 + boxWidth, median, ChartPalette.Black, 2.5);
        }

        double stripWidth = groupWidth * 0.6;
        int pointIndex = 0;
        var labels = group.PointLabels;
        for (int i = 0; i < group.MeasuredValues.Count; i++)
        {
            double value = group.MeasuredValues[i];
            if (!scale.CanShow(value)) continue;
            svg.Circle(centre + Jitter(pointIndex++) * stripWidth, area.ClampedY(scale, value), 3.2, colour, ChartPalette.Black, 0.5, 0.75,
                labels?[i]);
        }
        if (group.BelowDetectionCount > 0)
        {
            double y = double.IsNaN(apartRowY) ? area.Y(scale, limitRow) : apartRowY;
            for (int i = 0; i < group.BelowDetectionCount; i++)
                svg.Circle(centre + Jitter(pointIndex++) * stripWidth, y, 3.2, "none", colour, 1.5,
                    tooltip: labels?[group.MeasuredValues.Count + i]);
        }

        svg.Text(centre, area.Bottom + apartHeight + 17, ChartText.Shorten(group.Name, MaxGroupNameCharacters), TextAnchor.Middle, tooltip: group.Name);
        int sampleCount = group.MeasuredValues.Count + group.BelowDetectionCount;
        string counts = group.BelowDetectionCount > 0
            ? string.Create(CultureInfo.InvariantCulture, $"n = {sampleCount}, {group.BelowDetectionCount} below limit")
            : group.DrawnFrom is { } total && total > sampleCount
                ? string.Create(CultureInfo.InvariantCulture, $"n = {total} ({sampleCount} quantiles drawn)")
                : string.Create(CultureInfo.InvariantCulture, $"n = {sampleCount}");
        svg.Text(centre, area.Bottom + apartHeight + 32, counts, TextAnchor.Middle, 11, fill: ChartPalette.Axis);
        svg.EndGroup();
    }

    /// <summary>Sideways shift in [-1/2, 1/2) of point <paramref name="index"/>: frac(index φ) - 1/2.</summary>
    internal static double Jitter(int index)
    {
        double position = index * GoldenRatioConjugate;
        return position - Math.Floor(position) - 0.5;
    }

    private static string Describe(StripBoxChartOptions options, IReadOnlyList<StripGroup> groups)
    {
        var parts = new List<string>(groups.Count);
        foreach (var group in groups)
            parts.Add(string.Create(CultureInfo.InvariantCulture, $"{group.Name}: {group.MeasuredValues.Count} measured, {group.BelowDetectionCount} below detection"));
        return $"Strip and box plot of {options.ValueAxisLabel} by {options.GroupAxisLabel.ToLowerInvariant()}. {string.Join("; ", parts)}.";
    }
}
