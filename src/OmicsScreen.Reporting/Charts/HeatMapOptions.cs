namespace OmicsScreen.Reporting.Charts;

/// <summary>Settings of a <see cref="HeatMapChart"/>.</summary>
/// <param name="Title">Chart title, also its accessible name.</param>
/// <param name="ColourScaleLabel">What the colour shows, with its unit (for example "Spearman correlation").</param>
/// <param name="RowAxisLabel">What the rows are.</param>
/// <param name="ColumnAxisLabel">What the columns are.</param>
/// <param name="Description">Text for screen readers; a summary is generated when null.</param>
/// <param name="Minimum">Value drawn in full blue; -1 for a correlation.</param>
/// <param name="Maximum">Value drawn in full vermillion; 1 for a correlation.</param>
/// <param name="ShowValues">Print each cell's value in it; null prints them when the cells are large enough.</param>
public sealed record HeatMapOptions(
    string Title,
    string ColourScaleLabel,
    string RowAxisLabel = "Feature",
    string ColumnAxisLabel = "Feature",
    string? Description = null,
    double Minimum = -1,
    double Maximum = 1,
    bool? ShowValues = null);
