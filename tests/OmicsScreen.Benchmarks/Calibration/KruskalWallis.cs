using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// The Kruskal-Wallis rank test of k groups (Kruskal &amp; Wallis 1952, JASA 47:583-621), with
/// the tie correction and the chi-squared approximation on k - 1 degrees of freedom.
/// </summary>
public static class KruskalWallis
{
    /// <summary>
    /// p-value of H = [12 / (N (N + 1)) sum R_c^2 / n_c - 3 (N + 1)] / (1 - T / (N^3 - N)), with
    /// R_c the rank sum of group c and T the tie term; NaN when fewer than two groups are
    /// non-empty, when every value is tied, or when k - 1 is odd (only even degrees of freedom
    /// have the closed-form tail used here).
    /// </summary>
    public static double PValue(ReadOnlySpan<double> values, ReadOnlySpan<int> groups, int groupCount)
    {
        int total = values.Length;
        var ranks = new double[total];
        double tieTerm = Ranking.Rank(values, ranks);
        var rankSums = new double[groupCount];
        var counts = new int[groupCount];
        for (int i = 0; i < total; i++)
        {
            rankSums[groups[i]] += ranks[i];
            counts[groups[i]]++;
        }
        int occupied = 0;
        double sum = 0;
        for (int c = 0; c < groupCount; c++)
        {
            if (counts[c] == 0) continue;
            occupied++;
            sum += rankSums[c] * rankSums[c] / counts[c];
        }
        double sampleCount = total;
        double correction = 1 - tieTerm / (sampleCount * sampleCount * sampleCount - sampleCount);
        if (occupied < 2 || !(correction > 0)) return double.NaN;
        double h = (12 / (sampleCount * (sampleCount + 1)) * sum - 3 * (sampleCount + 1)) / correction;
        return ChiSquareUpperTail(Math.Max(0, h), occupied - 1);
    }

    /// <summary>
    /// P(chi-squared on 2m degrees of freedom &gt; x) = P(Poisson(x/2) &lt;= m - 1) = exp(-x/2) sum
    /// over j &lt; m of (x/2)^j / j! (the Poisson identity of the chi-squared tail, common practice;
    /// e.g. Abramowitz &amp; Stegun 1964, ch. 26, from memory); NaN for odd df.
    /// </summary>
    public static double ChiSquareUpperTail(double x, int degreesOfFreedom)
    {
        if (degreesOfFreedom < 2 || degreesOfFreedom % 2 != 0) return double.NaN;
        double half = x / 2, term = Math.Exp(-half), tail = 0;
        for (int j = 0; j < degreesOfFreedom / 2; j++)
        {
            tail += term;
            term *= half / (j + 1);
        }
        return Math.Min(1, tail);
    }
}
