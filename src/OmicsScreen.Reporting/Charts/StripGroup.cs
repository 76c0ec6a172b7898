namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// The values of one feature in one class for a <see cref="StripBoxChart"/>: the measured values
/// (missing cells left out by the caller) and how many samples were below the detection limit.
/// </summary>
/// <param name="PointLabels">
/// Optional hover text of each point: the measured values' labels first, in order, then one per
/// below-detection sample. Null draws points without labels.
/// </param>
public sealed record StripGroup(string Name, IReadOnlyList<double> MeasuredValues, int BelowDetectionCount = 0,
    IReadOnlyList<string>? PointLabels = null);
