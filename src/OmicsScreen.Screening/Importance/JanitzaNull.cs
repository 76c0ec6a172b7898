namespace OmicsScreen.Screening.Importance;

/// <summary>
/// The null distribution of Janitza, Celik &amp; Boulesteix (2018, Adv Data Anal Classif
/// 12:885-915) for an importance that is centred on 0 for null features (such as
/// <see cref="CorrectedImpurityImportance"/>): the observed importances themselves tell how
/// far null features stray, because negative values can only come from null features.
/// </summary>
/// <remarks>
/// The null sample is every negative importance v, its mirror -v, and every importance exactly 0
/// once (0 mirrored is itself, so it is not counted twice). Its size is 2·#{v &lt; 0} + #{v = 0}.
/// The p-value of a value x is the fraction of null values greater than or equal to x:
/// p(x) = #{u in null : u &gt;= x} / |null|. This counts ties against the feature (the choice that
/// keeps p valid); the strict form 1 - F0(x) differs only at ties. A large x can get p = 0; the
/// resolution is 1/|null|. When no importance is &lt;= 0 the null sample is empty and every
/// p-value is NaN: the importances give no evidence of how null features behave (too few
/// features, or all informative), so the caller must fall back on another null, such as
/// <see cref="OutcomePermutationNull"/>. A NaN importance is left out of the null and gets p = NaN.
/// </remarks>
public static class JanitzaNull
{
    /// <summary>The p-value of each importance against the null built from all of them.</summary>
    public static double[] PValues(ReadOnlySpan<double> importances) => PValues(importances, importances);

    /// <summary>The p-value of each scored value (for example decoys) against the null built from the importances.</summary>
    public static double[] PValues(ReadOnlySpan<double> importances, ReadOnlySpan<double> scored) =>
        ExceedanceShares(NullSample(importances), scored, pseudoCount: 0);

    /// <summary>
    /// For each scored value, (c + #{null &gt;= x}) / (c + |null|) with pseudo-count c; NaN for a NaN
    /// value or an empty null. The null sample is sorted in place.
    /// </summary>
    internal static double[] ExceedanceShares(double[] nullSample, ReadOnlySpan<double> scored, int pseudoCount)
    {
        var pValues = new double[scored.Length];
        if (nullSample.Length == 0)
        {
            Array.Fill(pValues, double.NaN);
            return pValues;
        }
        Array.Sort(nullSample);
        for (int i = 0; i < scored.Length; i++)
        {
            double value = scored[i];
            pValues[i] = double.IsNaN(value) ? double.NaN
                : (double)(pseudoCount + nullSample.Length - LowerBound(nullSample, value)) / (pseudoCount + nullSample.Length);
        }
        return pValues;
    }

    /// <summary>The negative importances, their mirrors, and the zeros once; unsorted.</summary>
    public static double[] NullSample(ReadOnlySpan<double> importances)
    {
        int negative = 0, zero = 0;
        foreach (double value in importances)
        {
            if (value < 0) negative++;
            else if (value == 0) zero++;
        }
        var sample = new double[2 * negative + zero];
        int next = 0;
        foreach (double value in importances)
        {
            if (value < 0)
            {
                sample[next++] = value;
                sample[next++] = -value;
            }
            else if (value == 0) sample[next++] = 0;
        }
        return sample;
    }

    /// <summary>The first index of an ascending array whose value is &gt;= x (the array's length if none).</summary>
    internal static int LowerBound(double[] sorted, double x)
    {
        int low = 0, high = sorted.Length;
        // Invariant: sorted[..low] < x and sorted[high..] >= x.
        while (low < high)
        {
            int middle = low + ((high - low) >> 1);
            if (sorted[middle] < x) low = middle + 1;
            else high = middle;
        }
        return low;
    }
}
