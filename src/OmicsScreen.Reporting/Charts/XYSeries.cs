namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// One series of an <see cref="XYChart"/>. Points with a non-finite coordinate (or a non-positive one
/// on a log axis) are skipped and break the line there. <paramref name="BandLow"/> and
/// <paramref name="BandHigh"/>, when given, shade a spread band (for example the 10th to 90th
/// percentile across repeats) and must have one value per point.
/// </summary>
public sealed record XYSeries(
    string Name,
    IReadOnlyList<double> X,
    IReadOnlyList<double> Y,
    XYSeriesStyle Style = XYSeriesStyle.Line,
    IReadOnlyList<double>? BandLow = null,
    IReadOnlyList<double>? BandHigh = null);
