namespace OmicsScreen.Reporting.Charts;

/// <summary>Settings of a <see cref="DotIntervalChart"/>.</summary>
/// <param name="Title">Chart title, also its accessible name.</param>
/// <param name="ValueAxisLabel">Label of the value axis, with its unit (for example "Permutation importance (AUC drop)").</param>
/// <param name="ItemAxisLabel">What the rows are (for example "Feature").</param>
/// <param name="Description">Text for screen readers; a summary is generated when null.</param>
/// <param name="ReferenceValue">A dashed vertical line (for example 0 importance); NaN for none.</param>
/// <param name="DrawBars">Draw a light bar from the reference value (or 0) to each value, as a bar chart.</param>
/// <param name="LegendText">Describes what the dot and the bar stand for; null for no legend.</param>
public sealed record DotIntervalChartOptions(
    string Title,
    string ValueAxisLabel,
    string ItemAxisLabel,
    string? Description = null,
    double ReferenceValue = double.NaN,
    bool DrawBars = false,
    string? LegendText = null,
    int Width = 720);
