namespace OmicsScreen.Reporting.Charts;

/// <summary>Draws a legend as rows of swatch + name, wrapping to the chart width.</summary>
internal static class LegendPainter
{
    /// <summary>Dash pattern of a dashed data series, shared with its legend swatch.</summary>
    public const string SeriesDash = "6 4";

    private const double RowHeight = 18;
    private const double SwatchWidth = 22;
    private const int MaxNameCharacters = 64;

    /// <summary>Height the legend will take when drawn across <paramref name="availableWidth"/>.</summary>
    public static double Height(IReadOnlyList<LegendEntry> entries, double availableWidth) =>
        entries.Count == 0 ? 0 : Layout(entries, availableWidth, null, 0, 0);

    /// <summary>Draws the legend from (left, top); returns its height.</summary>
    public static double Draw(SvgWriter svg, IReadOnlyList<LegendEntry> entries, double left, double top, double availableWidth)
    {
        if (entries.Count == 0) return 0;
        svg.BeginGroup("legend");
        double height = Layout(entries, availableWidth, svg, left, top);
        svg.EndGroup();
        return height;
    }

    // One pass serves both measuring (svg null) and drawing, so the two can never disagree.
    private static double Layout(IReadOnlyList<LegendEntry> entries, double availableWidth, SvgWriter? svg, double left, double top)
    {
        double x = 0;
        int row = 0;
        foreach (var entry in entries)
        {
            string name = ChartText.Shorten(entry.Name, MaxNameCharacters);
            double itemWidth = SwatchWidth + 6 + ChartText.EstimateWidth(name) + 16;
            if (x > 0 && x + itemWidth > availableWidth)
            {
                x = 0;
                row++;
            }
            if (svg is not null)
            {
                double middle = top + row * RowHeight + RowHeight / 2;
                Swatch(svg, entry, left + x, middle);
                svg.Text(left + x + SwatchWidth + 6, middle + 4, name, tooltip: entry.Name);
            }
            x += itemWidth;
        }
        return (row + 1) * RowHeight + 4;
    }

    private static void Swatch(SvgWriter svg, LegendEntry entry, double x, double middle)
    {
        switch (entry.Symbol)
        {
            case LegendSymbol.Line:
                svg.Line(x, middle, x + SwatchWidth, middle, entry.Colour, 2);
                break;
            case LegendSymbol.DashedLine:
                svg.Line(x, middle, x + SwatchWidth, middle, entry.Colour, 2, SeriesDash);
                break;
            case LegendSymbol.Dot:
                svg.Circle(x + SwatchWidth / 2, middle, 4, entry.Colour);
                break;
            case LegendSymbol.HollowDot:
                svg.Circle(x + SwatchWidth / 2, middle, 4, "none", entry.Colour, 1.5);
                break;
            case LegendSymbol.Band:
                svg.Rect(x, middle - 6, SwatchWidth, 12, entry.Colour, opacity: 0.25);
                break;
            case LegendSymbol.Diamond:
                double centre = x + SwatchWidth / 2;
                svg.Polygon([centre - 6, centre, centre + 6, centre], [middle, middle - 5, middle, middle + 5], entry.Colour);
                break;
        }
    }
}
