namespace OmicsScreen.Reporting.Charts;

/// <summary>Settings of a <see cref="StripBoxChart"/>.</summary>
/// <param name="Title">Chart title, also its accessible name (usually the feature name).</param>
/// <param name="ValueAxisLabel">Label of the value axis with its unit (for example "Intensity (log2)").</param>
/// <param name="GroupAxisLabel">What the groups are (for example "Class").</param>
/// <param name="Description">Text for screen readers; a summary is generated when null.</param>
/// <param name="DetectionLimit">The assay's limit, where below-detection samples are drawn; NaN when unknown (they are then drawn at the bottom of the axis).</param>
public sealed record StripBoxChartOptions(
    string Title,
    string ValueAxisLabel,
    string GroupAxisLabel = "Class",
    string? Description = null,
    AxisScaleKind ValueScale = AxisScaleKind.Linear,
    double DetectionLimit = double.NaN,
    int Width = 560,
    int Height = 420);
