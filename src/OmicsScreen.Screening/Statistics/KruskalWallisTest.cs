using MathNet.Numerics.Distributions;

namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// The Kruskal-Wallis test of a measurement across the levels of a grouping (Kruskal &amp; Wallis
/// 1952, JASA 47(260)): H on midranks with the tie correction, its p-value from the chi-square
/// distribution on levels - 1 degrees of freedom (as scipy.stats.kruskal computes it), and the
/// effect size epsilon-squared = H / ((n^2 - 1) / (n + 1)) = H / (n - 1), which runs from 0 to 1
/// (Tomczak &amp; Tomczak 2014, Trends in Sport Sciences 21(1)).
/// </summary>
public static class KruskalWallisTest
{
    /// <param name="values">The measurement of every sample; NaN values are left out.</param>
    /// <param name="levels">Each sample's level, 0 .. <paramref name="levelCount"/> - 1.</param>
    public static KruskalWallisResult Test(ReadOnlySpan<double> values, ReadOnlySpan<int> levels, int levelCount)
    {
        if (values.Length != levels.Length) throw new ArgumentException("Values and levels need one entry per sample.");
        var kept = new List<double>(values.Length);
        var keptLevels = new List<int>(values.Length);
        for (int i = 0; i < values.Length; i++)
        {
            if (double.IsNaN(values[i])) continue;
            if ((uint)levels[i] >= (uint)levelCount) throw new ArgumentOutOfRangeException(nameof(levels));
            kept.Add(values[i]);
            keptLevels.Add(levels[i]);
        }
        int n = kept.Count;
        var rankSums = new double[levelCount];
        var counts = new int[levelCount];
        var ranks = Ranking.Rank(kept.ToArray());
        for (int i = 0; i < n; i++)
        {
            rankSums[keptLevels[i]] += ranks[i];
            counts[keptLevels[i]]++;
        }
        int present = 0;
        double sum = 0;
        for (int l = 0; l < levelCount; l++)
        {
            if (counts[l] == 0) continue;
            present++;
            sum += rankSums[l] * rankSums[l] / counts[l];
        }
        if (present < 2 || n < 3) return new KruskalWallisResult(double.NaN, present - 1, double.NaN, double.NaN, n);
        double h = 12.0 / (n * (n + 1.0)) * sum - 3.0 * (n + 1);
        // Tie correction: divide by 1 - sum(t^3 - t) / (n^3 - n) over groups of t tied values.
        var sorted = kept.ToArray();
        Array.Sort(sorted);
        double ties = 0;
        for (int i = 0; i < n;)
        {
            int j = i + 1;
            while (j < n && sorted[j] == sorted[i]) j++;
            double t = j - i;
            ties += t * t * t - t;
            i = j;
        }
        double correction = 1.0 - ties / ((double)n * n * n - n);
        if (correction <= 0) return new KruskalWallisResult(double.NaN, present - 1, double.NaN, double.NaN, n);
        h /= correction;
        int df = present - 1;
        double p = 1.0 - ChiSquared.CDF(df, h);
        return new KruskalWallisResult(h, df, p, h / (n - 1.0), n);
    }
}
