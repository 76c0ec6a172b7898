namespace OmicsScreen.Reporting.Charts;

/// <summary>Settings of an <see cref="XYChart"/>.</summary>
/// <param name="Title">Chart title, also its accessible name.</param>
/// <param name="XAxisLabel">x axis label with its unit.</param>
/// <param name="YAxisLabel">y axis label with its unit.</param>
/// <param name="Description">Text for screen readers; a summary is generated when null.</param>
/// <param name="YMinimum">Fixed lower end of the y axis (for example 0 for a frequency); NaN to fit the data.</param>
/// <param name="YMaximum">Fixed upper end of the y axis (for example 1); NaN to fit the data.</param>
public sealed record XYChartOptions(
    string Title,
    string XAxisLabel,
    string YAxisLabel,
    string? Description = null,
    AxisScaleKind XScale = AxisScaleKind.Linear,
    AxisScaleKind YScale = AxisScaleKind.Linear,
    double YMinimum = double.NaN,
    double YMaximum = double.NaN,
    int Width = 720,
    int Height = 420);
