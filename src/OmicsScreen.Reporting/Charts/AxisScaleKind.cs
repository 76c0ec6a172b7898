namespace OmicsScreen.Reporting.Charts;

/// <summary>How a numeric axis maps values to positions.</summary>
public enum AxisScaleKind
{
    Linear = 0,
    /// <summary>Base-10 logarithmic; only positive values can be drawn.</summary>
    Log10 = 1,
}
