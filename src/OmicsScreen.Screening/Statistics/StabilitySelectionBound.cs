namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// The error bound of stability selection by Meinshausen &amp; Buhlmann (2010, JRSS-B 72:417-473, Theorem 1).
/// </summary>
/// <remarks>
/// For a selection threshold pi_thr in (1/2, 1], q the mean number of features selected per repeat
/// and p the number of features, the expected number of falsely selected features among those with
/// selection frequency &gt;= pi_thr is at most E[V] &lt;= q^2 / ((2 pi_thr - 1) p). The theorem assumes
/// the noise features are exchangeable and the base procedure beats random guessing; it is a bound,
/// often loose, not an estimate.
/// </remarks>
public static class StabilitySelectionBound
{
    /// <summary>The bound on E[V] for the given q, threshold and number of features.</summary>
    public static double ExpectedFalseSelections(double meanSelectedCount, double threshold, int featureCount)
    {
        CheckThreshold(threshold);
        if (featureCount < 1) throw new ArgumentOutOfRangeException(nameof(featureCount));
        if (meanSelectedCount < 0 || meanSelectedCount > featureCount) throw new ArgumentOutOfRangeException(nameof(meanSelectedCount));
        return meanSelectedCount * meanSelectedCount / ((2 * threshold - 1) * featureCount);
    }

    /// <summary>
    /// The smallest threshold whose bound is at most <paramref name="expectedFalseSelections"/>:
    /// pi_thr = (1 + q^2 / (p E[V])) / 2; above 1 when no threshold achieves it.
    /// </summary>
    public static double ThresholdFor(double meanSelectedCount, int featureCount, double expectedFalseSelections)
    {
        if (!(expectedFalseSelections > 0)) throw new ArgumentOutOfRangeException(nameof(expectedFalseSelections));
        if (featureCount < 1) throw new ArgumentOutOfRangeException(nameof(featureCount));
        return 0.5 * (1 + meanSelectedCount * meanSelectedCount / (featureCount * expectedFalseSelections));
    }

    private static void CheckThreshold(double threshold)
    {
        if (!(threshold > 0.5 && threshold <= 1))
            throw new ArgumentOutOfRangeException(nameof(threshold), "The bound holds only for thresholds in (0.5, 1].");
    }
}
