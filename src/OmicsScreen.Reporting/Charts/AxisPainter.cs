namespace OmicsScreen.Reporting.Charts;

/// <summary>Draws numeric axes: light grid lines, tick marks, tick labels and the axis title.</summary>
internal static class AxisPainter
{
    public const double TickLength = 5;

    /// <summary>Space below the plot area that a bottom axis needs: tick labels and the axis title.</summary>
    public const double BottomAxisHeight = 44;

    /// <summary>Space left of the plot area that a left axis with these ticks needs.</summary>
    public static double LeftAxisWidth(IAxisScale scale) => ChartText.WidestLabel(scale.Ticks) + TickLength + 30;

    public static void Bottom(SvgWriter svg, IAxisScale scale, PlotArea area, string label, bool grid = true)
    {
        svg.BeginGroup("x axis: " + label);
        foreach (var tick in scale.Ticks)
        {
            double x = area.X(scale, tick.Value);
            if (grid) svg.Line(x, area.Top, x, area.Bottom, ChartPalette.Grid);
            svg.Line(x, area.Bottom, x, area.Bottom + TickLength, ChartPalette.Axis);
            svg.Text(x, area.Bottom + TickLength + 13, tick.Label, TextAnchor.Middle);
        }
        svg.Line(area.Left, area.Bottom, area.Right, area.Bottom, ChartPalette.Axis);
        svg.Text(area.Left + area.Width / 2, area.Bottom + BottomAxisHeight - 6, label, TextAnchor.Middle, bold: true);
        svg.EndGroup();
    }

    public static void Left(SvgWriter svg, IAxisScale scale, PlotArea area, string label, bool grid = true)
    {
        svg.BeginGroup("y axis: " + label);
        double widest = ChartText.WidestLabel(scale.Ticks);
        foreach (var tick in scale.Ticks)
        {
            double y = area.Y(scale, tick.Value);
            if (grid) svg.Line(area.Left, y, area.Right, y, ChartPalette.Grid);
            svg.Line(area.Left - TickLength, y, area.Left, y, ChartPalette.Axis);
            svg.Text(area.Left - TickLength - 3, y + 4, tick.Label, TextAnchor.End);
        }
        svg.Line(area.Left, area.Top, area.Left, area.Bottom, ChartPalette.Axis);
        double titleX = area.Left - TickLength - widest - 14;
        svg.Text(titleX, area.Top + area.Height / 2, label, TextAnchor.Middle, bold: true, rotateDegrees: -90);
        svg.EndGroup();
    }

    /// <summary>Dash pattern of reference lines (null effect, thresholds, detection limits).</summary>
    public const string ReferenceDash = "5 4";

    /// <summary>A dashed vertical line across the plot at <paramref name="value"/>; nothing when the axis cannot show it.</summary>
    public static void VerticalReference(SvgWriter svg, IAxisScale scale, PlotArea area, double value)
    {
        if (!scale.CanShow(value)) return;
        double x = area.ClampedX(scale, value);
        svg.Line(x, area.Top, x, area.Bottom, ChartPalette.Axis, 1.25, ReferenceDash);
    }

    /// <summary>A dashed horizontal line across the plot at <paramref name="value"/>; nothing when the axis cannot show it.</summary>
    public static void HorizontalReference(SvgWriter svg, IAxisScale scale, PlotArea area, double value)
    {
        if (!scale.CanShow(value)) return;
        double y = area.ClampedY(scale, value);
        svg.Line(area.Left, y, area.Right, y, ChartPalette.Axis, 1.25, ReferenceDash);
    }

    /// <summary>The chart title, centred at the top; returns the y below it.</summary>
    public static double Title(SvgWriter svg, int width, string title)
    {
        const double titleSize = 15;
        int maxCharacters = Math.Max(10, (int)((width - 20) / (titleSize * ChartText.AverageGlyphWidth)));
        svg.Text(width / 2.0, 22, ChartText.Shorten(title, maxCharacters), TextAnchor.Middle, titleSize, bold: true, tooltip: title);
        return 34;
    }
}
