using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Locking;

/// <summary>
/// What one marker's discovery measurements looked like, so a new cohort measured on another
/// scale (another unit, a log transform, another platform) is noticed before it is scored.
/// </summary>
/// <param name="Median">Median of the measured values (quantile type 7, as the quartiles).</param>
/// <param name="LowerQuartile">First quartile of the measured values.</param>
/// <param name="UpperQuartile">Third quartile of the measured values.</param>
/// <param name="Minimum">Smallest measured value.</param>
/// <param name="Maximum">Largest measured value.</param>
/// <param name="MissingShare">Fraction of samples with the cell missing.</param>
/// <param name="BelowDetectionShare">Fraction of samples below the detection limit.</param>
/// <param name="MeasuredCount">Samples with a measured value.</param>
public sealed record MarkerScale(
    double Median,
    double LowerQuartile,
    double UpperQuartile,
    double Minimum,
    double Maximum,
    double MissingShare,
    double BelowDetectionShare,
    int MeasuredCount)
{
    public double InterquartileRange => UpperQuartile - LowerQuartile;

    /// <summary>Summarises one column of a matrix; statistics of a marker never measured are NaN.</summary>
    public static MarkerScale Describe(FeatureMatrix matrix, int feature)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int sampleCount = matrix.SampleCount;
        var column = matrix.Column(feature);
        var states = matrix.States(feature);
        var measured = new double[sampleCount];
        int measuredCount = 0, missing = 0, belowDetection = 0;
        for (int s = 0; s < sampleCount; s++)
        {
            var state = states.IsEmpty ? CellState.Measured : states[s];
            if (state == CellState.BelowDetection) belowDetection++;
            else if (state == CellState.Missing || float.IsNaN(column[s])) missing++;
            else measured[measuredCount++] = column[s];
        }
        var sorted = measured.AsSpan(0, measuredCount);
        sorted.Sort();
        double share = sampleCount > 0 ? 1.0 / sampleCount : double.NaN;
        return new MarkerScale(
            Quantile.MedianOfSorted(sorted),
            Quantile.OfSorted(sorted, 0.25, QuantileDefinition.Linear),
            Quantile.OfSorted(sorted, 0.75, QuantileDefinition.Linear),
            measuredCount > 0 ? sorted[0] : double.NaN,
            measuredCount > 0 ? sorted[^1] : double.NaN,
            missing * share,
            belowDetection * share,
            measuredCount);
    }
}
