namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// A forest plot: one row per cohort with its estimate (a square whose side grows with the square
/// root of the cohort's weight, so its area tracks the weight, the usual convention described by
/// Lewis &amp; Clarke 2001, BMJ 322:1479, from memory) and confidence interval, a
/// pooled estimate as a diamond spanning its interval, a dashed line at the null effect, and the
/// numbers printed to the right.
/// </summary>
public static class ForestPlotChart
{
    private const double RowHeight = 26;
    private const double NumberColumnWidth = 150;
    private const int MaxLabelCharacters = 30;
    private const double MaxSquareSide = 16;
    private const double MinSquareSide = 5;

    public static SvgImage Render(ForestPlotOptions options, IReadOnlyList<ForestRow> rows, ForestRow? pooled = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(rows);
        var range = new DataRange();
        double maxWeight = 0;
        foreach (var row in rows)
        {
            range.Include(row.Estimate);
            range.Include(row.Low);
            range.Include(row.High);
            if (double.IsFinite(row.Weight) && row.Weight > maxWeight) maxWeight = row.Weight;
        }
        if (pooled is not null)
        {
            range.Include(pooled.Estimate);
            range.Include(pooled.Low);
            range.Include(pooled.High);
        }
        range.Include(options.NullValue);
        var scale = range.Scale(AxisScaleKind.Linear);

        double labelWidth = ChartText.EstimateWidth(options.StudyAxisLabel, 12);
        foreach (var row in rows) labelWidth = Math.Max(labelWidth, ChartText.EstimateWidth(ChartText.Shorten(row.Label, MaxLabelCharacters)));
        if (pooled is not null) labelWidth = Math.Max(labelWidth, ChartText.EstimateWidth(ChartText.Shorten(pooled.Label, MaxLabelCharacters)));
        double left = labelWidth + 24;
        int slotCount = Math.Max(1, rows.Count) + (pooled is null ? 0 : 1);
        double top = 34 + 22; // title, then the column headings
        var area = new PlotArea(left, top, options.Width - left - NumberColumnWidth - 16, slotCount * RowHeight + 8);
        int height = (int)Math.Ceiling(area.Bottom + AxisPainter.BottomAxisHeight + 8);

        var svg = new SvgWriter(options.Width, height, options.Title, options.Description ?? Describe(options, rows, pooled));
        AxisPainter.Title(svg, options.Width, options.Title);
        svg.Text(area.Left - 12, top - 8, options.StudyAxisLabel, TextAnchor.End, bold: true);
        svg.Text(area.Right + NumberColumnWidth, top - 8, "Estimate [interval]", TextAnchor.End, bold: true);
        AxisPainter.Bottom(svg, scale, area, options.EffectAxisLabel);
        AxisPainter.VerticalReference(svg, scale, area, options.NullValue);

        svg.BeginGroup("studies");
        for (int i = 0; i < rows.Count; i++)
        {
            var row = rows[i];
            double y = area.Top + 4 + (i + 0.5) * RowHeight;
            svg.Text(area.Left - 12, y + 4, ChartText.Shorten(row.Label, MaxLabelCharacters), TextAnchor.End, tooltip: row.Label);
            if (double.IsFinite(row.Low) && double.IsFinite(row.High))
                svg.Line(area.ClampedX(scale, row.Low), y, area.ClampedX(scale, row.High), y, ChartPalette.Black, 1.5);
            if (double.IsFinite(row.Estimate))
            {
                double side = maxWeight > 0 && double.IsFinite(row.Weight) && row.Weight >= 0
                    ? MinSquareSide + (MaxSquareSide - MinSquareSide) * Math.Sqrt(row.Weight / maxWeight) // a floor keeps light cohorts visible
                    : (MinSquareSide + MaxSquareSide) / 2;
                svg.Rect(area.X(scale, row.Estimate) - side / 2, y - side / 2, side, side, ChartPalette.Blue);
            }
            svg.Text(area.Right + NumberColumnWidth, y + 4, Numbers(row, options.Decimals), TextAnchor.End);
        }
        svg.EndGroup();

        if (pooled is not null)
        {
            svg.BeginGroup("pooled estimate");
            double y = area.Top + 4 + (rows.Count + 0.5) * RowHeight;
            svg.Line(area.Left - 12 - labelWidth, y - RowHeight / 2, area.Right + NumberColumnWidth, y - RowHeight / 2, ChartPalette.Grid);
            svg.Text(area.Left - 12, y + 4, ChartText.Shorten(pooled.Label, MaxLabelCharacters), TextAnchor.End, bold: true, tooltip: pooled.Label);
            if (double.IsFinite(pooled.Estimate) && double.IsFinite(pooled.Low) && double.IsFinite(pooled.High))
            {
                double low = area.ClampedX(scale, pooled.Low), centre = area.X(scale, pooled.Estimate), high = area.ClampedX(scale, pooled.High);
                svg.Polygon([low, centre, high, centre], [y, y - 7, y, y + 7], ChartPalette.Vermillion, 1, ChartPalette.Black);
            }
            svg.Text(area.Right + NumberColumnWidth, y + 4, Numbers(pooled, options.Decimals), TextAnchor.End, bold: true);
            svg.EndGroup();
        }
        return svg.Finish();
    }

    private static string Numbers(ForestRow row, int decimals) =>
        $"{ChartNumber.Fixed(row.Estimate, decimals)} [{ChartNumber.Fixed(row.Low, decimals)}, {ChartNumber.Fixed(row.High, decimals)}]";

    private static string Describe(ForestPlotOptions options, IReadOnlyList<ForestRow> rows, ForestRow? pooled)
    {
        var parts = new List<string>(rows.Count + 1);
        foreach (var row in rows) parts.Add($"{row.Label} {Numbers(row, options.Decimals)}");
        if (pooled is not null) parts.Add($"{pooled.Label} {Numbers(pooled, options.Decimals)}");
        return $"Forest plot of {options.EffectAxisLabel} by {options.StudyAxisLabel.ToLowerInvariant()}: {string.Join("; ", parts)}.";
    }
}
