namespace OmicsScreen.Reporting.Charts;

/// <summary>How an <see cref="XYSeries"/> is drawn.</summary>
public enum XYSeriesStyle
{
    Line = 0,
    Points = 1,
    LineAndPoints = 2,
    /// <summary>A dashed line, to tell an optimistic estimate from a selection-aware one without relying on colour.</summary>
    DashedLine = 3,
}
