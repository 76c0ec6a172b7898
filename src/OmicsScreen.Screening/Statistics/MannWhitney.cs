namespace OmicsScreen.Screening.Statistics;

/// <summary>The Mann-Whitney U test with the large-sample normal approximation.</summary>
/// <remarks>
/// Conventions, chosen to agree with scipy.stats.mannwhitneyu(method="asymptotic",
/// alternative="two-sided"): U is the positive sample's statistic, U = R1 - n1 (n1 + 1) / 2 with
/// midranks R1; the test uses U* = max(U, n1 n0 - U) and
/// z = (U* - n1 n0 / 2 - 1/2) / sqrt(n1 n0 / 12 * ((N + 1) - T / (N (N - 1)))),
/// with T the tie term (Mann &amp; Whitney 1947; tie correction Lehmann 1975, eq. 1.41), and
/// p = 2 P(Z &gt; z), capped at 1. The tail uses erfc so p stays accurate down to about 1e-300.
/// </remarks>
public static class MannWhitney
{
    /// <summary>Tests a positive sample against a negative one; NaN values are rejected.</summary>
    public static MannWhitneyResult Test(ReadOnlySpan<double> positive, ReadOnlySpan<double> negative)
    {
        int total = positive.Length + negative.Length;
        var pooled = new double[total];
        positive.CopyTo(pooled);
        negative.CopyTo(pooled.AsSpan(positive.Length));
        var ranks = new double[total];
        double tieTerm = Ranking.Rank(pooled, ranks);
        double positiveRankSum = 0;
        for (int i = 0; i < positive.Length; i++) positiveRankSum += ranks[i];
        return FromRankSum(positiveRankSum, positive.Length, negative.Length, tieTerm);
    }

    /// <summary>The test from the positive sample's midrank sum in the pooled sample and the pooled tie term.</summary>
    public static MannWhitneyResult FromRankSum(double positiveRankSum, int positiveCount, int negativeCount, double tieTerm)
    {
        if (positiveCount == 0 || negativeCount == 0)
            return new MannWhitneyResult(double.NaN, double.NaN, double.NaN, double.NaN, positiveCount, negativeCount);
        double n1 = positiveCount, n0 = negativeCount;
        double u = positiveRankSum - n1 * (n1 + 1) * 0.5;
        double z = ContinuityCorrectedZ(u, positiveCount, negativeCount, tieTerm);
        double p = double.IsNaN(z) ? 1.0 : Math.Min(1.0, 2.0 * NormalTail.Upper(z));
        return new MannWhitneyResult(u, u / (n1 * n0), z, p, positiveCount, negativeCount);
    }

    /// <summary>
    /// z of max(U, n1 n0 - U) with continuity correction; NaN when every value is tied (no variance),
    /// in which case the two-sided p-value is 1.
    /// </summary>
    public static double ContinuityCorrectedZ(double u, int positiveCount, int negativeCount, double tieTerm)
    {
        double n1 = positiveCount, n0 = negativeCount, total = n1 + n0;
        double pairs = n1 * n0;
        double upper = Math.Max(u, pairs - u);
        double variance = pairs / 12.0 * ((total + 1) - tieTerm / (total * (total - 1)));
        if (!(variance > 0)) return double.NaN;
        return (upper - pairs * 0.5 - 0.5) / Math.Sqrt(variance);
    }
}
