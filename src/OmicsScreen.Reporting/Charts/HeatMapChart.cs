using System.Globalization;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// A labelled heat map on a diverging colour scale (<see cref="ChartPalette.Diverging"/>): the
/// correlation matrix of the shortlist. Cells without a value are grey and named in the legend.
/// </summary>
public static class HeatMapChart
{
    private const int MaxLabelCharacters = 28;
    private const double MinCellSize = 12;
    private const double MaxCellSize = 40;
    private const double TargetGridWidth = 560;
    private const double ValueTextMinCellSize = 30;
    private const int LegendSteps = 20;

    public static SvgImage Render(HeatMapOptions options, IReadOnlyList<string> rowLabels, IReadOnlyList<string> columnLabels, double[,] values)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(rowLabels);
        ArgumentNullException.ThrowIfNull(columnLabels);
        ArgumentNullException.ThrowIfNull(values);
        int rowCount = rowLabels.Count, columnCount = columnLabels.Count;
        if (values.GetLength(0) != rowCount || values.GetLength(1) != columnCount)
            throw new ArgumentException($"The matrix is {values.GetLength(0)} x {values.GetLength(1)}; the labels say {rowCount} x {columnCount}.", nameof(values));
        if (rowCount == 0 || columnCount == 0) throw new ArgumentException("A heat map needs at least one row and column.", nameof(values));
        if (!(options.Maximum > options.Minimum)) throw new ArgumentException("The colour scale needs Maximum above Minimum.", nameof(options));

        double cell = Math.Clamp(TargetGridWidth / Math.Max(rowCount, columnCount), MinCellSize, MaxCellSize);
        bool showValues = options.ShowValues ?? cell >= ValueTextMinCellSize;
        double rowLabelWidth = WidestShortened(rowLabels);
        double columnLabelHeight = WidestShortened(columnLabels) * 0.71 + 12; // labels run at 45 degrees: height = width x sin 45
        double left = rowLabelWidth + 40;
        double top = 34 + columnLabelHeight;
        var area = new PlotArea(left, top, columnCount * cell, rowCount * cell);
        int width = (int)Math.Ceiling(area.Right + 150);
        int height = (int)Math.Ceiling(Math.Max(area.Bottom + 40, top + 250));

        var svg = new SvgWriter(width, height, options.Title, options.Description
            ?? string.Create(CultureInfo.InvariantCulture, $"Heat map of {options.ColourScaleLabel} between {rowCount} {options.RowAxisLabel.ToLowerInvariant()} rows and {columnCount} {options.ColumnAxisLabel.ToLowerInvariant()} columns; blue is low, vermillion is high."));
        AxisPainter.Title(svg, width, options.Title);

        svg.BeginGroup("cells");
        for (int r = 0; r < rowCount; r++)
        {
            for (int c = 0; c < columnCount; c++)
            {
                double value = values[r, c];
                string colour = ChartPalette.Diverging(value, options.Minimum, options.Maximum);
                double x = area.Left + c * cell, y = area.Top + r * cell;
                svg.Rect(x, y, cell, cell, colour, "#ffffff", 0.5);
                if (showValues)
                {
                    string text = ChartNumber.Fixed(value, 2);
                    string ink = ChartPalette.PrefersDarkText(colour) ? SvgWriter.TextColour : "#ffffff";
                    svg.Text(x + cell / 2, y + cell / 2 + 4, text, TextAnchor.Middle, 10, fill: ink);
                }
            }
        }
        svg.EndGroup();

        svg.BeginGroup("row labels: " + options.RowAxisLabel);
        for (int r = 0; r < rowCount; r++)
            svg.Text(area.Left - 6, area.Top + (r + 0.5) * cell + 4, ChartText.Shorten(rowLabels[r], MaxLabelCharacters), TextAnchor.End, tooltip: rowLabels[r]);
        svg.Text(14, area.Top + area.Height / 2, options.RowAxisLabel, TextAnchor.Middle, bold: true, rotateDegrees: -90);
        svg.EndGroup();

        svg.BeginGroup("column labels: " + options.ColumnAxisLabel);
        for (int c = 0; c < columnCount; c++)
            svg.Text(area.Left + (c + 0.5) * cell, area.Top - 6, ChartText.Shorten(columnLabels[c], MaxLabelCharacters), TextAnchor.Start,
                rotateDegrees: -45, tooltip: columnLabels[c]);
        svg.Text(area.Left + area.Width / 2, area.Bottom + 24, options.ColumnAxisLabel, TextAnchor.Middle, bold: true);
        svg.EndGroup();

        DrawColourLegend(svg, options, values, area.Right + 24, top);
        return svg.Finish();
    }

    private static void DrawColourLegend(SvgWriter svg, HeatMapOptions options, double[,] values, double x, double top)
    {
        const double barWidth = 14, barHeight = 200;
        svg.BeginGroup("colour scale: " + options.ColourScaleLabel);
        double step = barHeight / LegendSteps;
        for (int i = 0; i < LegendSteps; i++)
        {
            // Step i from the top shows the value at its middle, from Maximum down to Minimum.
            double value = options.Maximum - (i + 0.5) / LegendSteps * (options.Maximum - options.Minimum);
            svg.Rect(x, top + i * step, barWidth, step + 0.5, ChartPalette.Diverging(value, options.Minimum, options.Maximum));
        }
        svg.Rect(x, top, barWidth, barHeight, "none", ChartPalette.Axis);
        double middle = (options.Minimum + options.Maximum) / 2;
        svg.Text(x + barWidth + 4, top + 4, ChartNumber.Fixed(options.Maximum, 2), size: 11);
        svg.Text(x + barWidth + 4, top + barHeight / 2 + 4, ChartNumber.Fixed(middle, 2), size: 11);
        svg.Text(x + barWidth + 4, top + barHeight + 4, ChartNumber.Fixed(options.Minimum, 2), size: 11);
        svg.Text(x + barWidth + 52, top + barHeight / 2, options.ColourScaleLabel, TextAnchor.Middle, bold: true, rotateDegrees: -90);
        if (HasMissing(values))
        {
            svg.Rect(x, top + barHeight + 16, barWidth, barWidth, ChartPalette.NoValue);
            svg.Text(x + barWidth + 4, top + barHeight + 27, "no value", size: 11);
        }
        svg.EndGroup();
    }

    private static bool HasMissing(double[,] values)
    {
        foreach (double value in values)
            if (double.IsNaN(value)) return true;
        return false;
    }

    private static double WidestShortened(IReadOnlyList<string> labels)
    {
        double widest = 0;
        foreach (var label in labels) widest = Math.Max(widest, ChartText.EstimateWidth(ChartText.Shorten(label, MaxLabelCharacters)));
        return widest;
    }
}
