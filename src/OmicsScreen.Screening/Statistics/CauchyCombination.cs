namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// The Cauchy combination test of Liu &amp; Xie (2020, JASA 115(529):393-402): p-values are turned
/// into standard Cauchy variables tan((0.5 - p) pi), averaged with weights, and the average's
/// Cauchy tail gives the combined p-value. Its tail is exact under independence and accurate for
/// small p-values under any dependence between the tests, which is the case here: the forest's
/// importance and the rank test look at the same samples.
/// </summary>
public static class CauchyCombination
{
    /// <summary>Below this, tan((0.5 - p) pi) is computed as 1/(p pi), its limit, to keep precision.</summary>
    private const double SmallP = 1e-15;

    /// <summary>The combined p-value of two tests with equal weights; NaN inputs are left out (both NaN gives NaN).</summary>
    public static double Combine(double first, double second)
    {
        if (double.IsNaN(first)) return second;
        if (double.IsNaN(second)) return first;
        double statistic = 0.5 * ToCauchy(first) + 0.5 * ToCauchy(second);
        return FromCauchy(statistic);
    }

    /// <summary>The combined p-value of several tests with equal weights over those that are not NaN (all NaN gives NaN).</summary>
    public static double Combine(ReadOnlySpan<double> pValues)
    {
        double sum = 0;
        int count = 0;
        foreach (double p in pValues)
        {
            if (double.IsNaN(p)) continue;
            sum += ToCauchy(p);
            count++;
        }
        return count == 0 ? double.NaN : FromCauchy(sum / count);
    }

    /// <summary>
    /// The combined p-value with the given non-negative weights, renormalised over the tests that
    /// are not NaN (Liu &amp; Xie 2020 allow any weights summing to 1); all NaN gives NaN.
    /// </summary>
    public static double Combine(ReadOnlySpan<double> pValues, ReadOnlySpan<double> weights)
    {
        if (weights.Length != pValues.Length) throw new ArgumentException("One weight is needed per p-value.", nameof(weights));
        double sum = 0, total = 0;
        for (int i = 0; i < pValues.Length; i++)
        {
            if (double.IsNaN(pValues[i])) continue;
            if (!(weights[i] >= 0)) throw new ArgumentOutOfRangeException(nameof(weights), "Weights must be zero or more.");
            sum += weights[i] * ToCauchy(pValues[i]);
            total += weights[i];
        }
        return total > 0 ? FromCauchy(sum / total) : double.NaN;
    }

    private static double ToCauchy(double p)
    {
        p = Math.Clamp(p, 1e-300, 1);
        if (p < SmallP) return 1 / (p * Math.PI);
        return Math.Tan((0.5 - p) * Math.PI);
    }

    /// <summary>P(C &gt;= t) for a standard Cauchy C: 1/2 - atan(t)/pi, written as atan(1/t)/pi for t &gt; 0 to keep precision far in the tail.</summary>
    private static double FromCauchy(double statistic)
    {
        if (statistic > 0) return Math.Atan(1 / statistic) / Math.PI;
        return 0.5 - Math.Atan(statistic) / Math.PI;
    }
}
