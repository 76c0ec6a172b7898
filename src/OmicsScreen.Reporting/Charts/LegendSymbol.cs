namespace OmicsScreen.Reporting.Charts;

/// <summary>How a legend entry's swatch is drawn.</summary>
internal enum LegendSymbol
{
    Line = 0,
    DashedLine = 1,
    Dot = 2,
    HollowDot = 3,
    Band = 4,
    Diamond = 5,
}
