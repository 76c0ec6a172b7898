namespace OmicsScreen.Reporting.Charts;

/// <summary>The axis a reference line is drawn across.</summary>
public enum ChartAxis
{
    /// <summary>A vertical line at an x value.</summary>
    X = 0,
    /// <summary>A horizontal line at a y value.</summary>
    Y = 1,
}
