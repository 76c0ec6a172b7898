using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// The five numbers of a Tukey box plot: quartiles by Hyndman &amp; Fan type 7 (the R and numpy
/// default), whiskers to the most extreme values within 1.5 IQR of the box (Tukey 1977,
/// Exploratory Data Analysis).
/// </summary>
internal readonly record struct BoxSummary(double LowerWhisker, double LowerQuartile, double Median, double UpperQuartile, double UpperWhisker)
{
    private const double FenceFactor = 1.5;

    /// <summary>The summary of <paramref name="sortedValues"/> (ascending, finite, at least one value).</summary>
    public static BoxSummary OfSorted(ReadOnlySpan<double> sortedValues)
    {
        if (sortedValues.IsEmpty) throw new ArgumentException("A box plot needs at least one value.", nameof(sortedValues));
        double q1 = Quantile.OfSorted(sortedValues, 0.25, QuantileDefinition.Linear);
        double median = Quantile.OfSorted(sortedValues, 0.5, QuantileDefinition.Linear);
        double q3 = Quantile.OfSorted(sortedValues, 0.75, QuantileDefinition.Linear);
        double iqr = q3 - q1;
        double lowFence = q1 - FenceFactor * iqr, highFence = q3 + FenceFactor * iqr;
        // Sorted order: the first value at or above the low fence and the last at or below the high fence.
        int low = 0;
        while (sortedValues[low] < lowFence) low++;
        int high = sortedValues.Length - 1;
        while (sortedValues[high] > highFence) high--;
        return new BoxSummary(sortedValues[low], q1, median, q3, sortedValues[high]);
    }
}
