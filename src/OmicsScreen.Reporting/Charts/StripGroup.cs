namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// The values of one feature in one class for a <see cref="StripBoxChart"/>: the measured values
/// (missing cells left out by the caller) and how many samples were below the detection limit.
/// </summary>
/// <param name="PointLabels">
/// Optional hover text of each point: the measured values' labels first, in order, then one per
/// below-detection sample. Null draws points without labels.
/// </param>
/// <param name="DrawnFrom">When the values are a thinned sample (evenly spaced quantiles) of a larger group: that group's size, shown beside the count drawn.</param>
public sealed record StripGroup(string Name, IReadOnlyList<double> MeasuredValues, int BelowDetectionCount = 0,
    IReadOnlyList<string>? PointLabels = null, int? DrawnFrom = null);
