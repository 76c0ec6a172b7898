using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class RankBiasedOverlapTests
{
    // S = a b c d, T = b a d e. Overlaps X_1..X_4 = 0, 2, 2, 3 (by hand).
    private static readonly string[] First = ["a", "b", "c", "d"];
    private static readonly string[] Second = ["b", "a", "d", "e"];

    [Fact]
    public void Rbo_at_depth_is_the_weighted_sum_of_agreements()
    {
        // Webber, Moffat & Zobel (2010), eq. 7 truncated at depth 4, p = 0.9:
        // 0.1 * (0.9^0 * 0/1 + 0.9^1 * 2/2 + 0.9^2 * 2/3 + 0.9^3 * 3/4).
        double expected = 0.1 * (0 + 0.9 * 1 + 0.81 * 2.0 / 3 + 0.729 * 0.75);
        Assert.Equal(expected, RankBiasedOverlap.AtDepth<string>(First, Second, 0.9, 4), 14);
        Assert.Equal(0.198675, expected, 12);
    }

    [Fact]
    public void Extrapolated_rbo_of_even_lists_matches_eq_30_by_hand()
    {
        // RBO_ext = X_k/k p^k + (1-p)/p sum_{d=1..k} X_d/d p^d, k = 4, p = 0.9.
        double sum = 0 * 0.9 / 1 + 2 * 0.81 / 2 + 2 * 0.729 / 3 + 3 * 0.6561 / 4;
        double expected = 0.75 * 0.6561 + 0.1 / 0.9 * sum;
        Assert.Equal(expected, RankBiasedOverlap.Extrapolated<string>(First, Second, 0.9), 14);
        Assert.Equal(0.69075, expected, 12);
    }

    [Fact]
    public void Minimum_rbo_of_even_lists_matches_eq_11_by_hand()
    {
        // RBO_min = (1-p)/p [ sum_{d=1..k} (X_d - X_k) p^d / d - X_k ln(1 - p) ], X_k = 3.
        double sum = (0 - 3) * 0.9 / 1 + (2 - 3) * 0.81 / 2 + (2 - 3) * 0.729 / 3 + 0;
        double expected = 0.1 / 0.9 * (sum - 3 * Math.Log(0.1));
        Assert.Equal(expected, RankBiasedOverlap.Minimum<string>(First, Second, 0.9), 14);
    }

    [Fact]
    public void Extrapolated_rbo_of_uneven_lists_matches_eq_32_by_hand()
    {
        // S = a b c (s = 3), L = c x a y b (l = 5), p = 0.8. X_1..X_5 = 0, 0, 2, 2, 3; X_s = 2, X_l = 3.
        // RBO_ext = (1-p)/p [ sum_{d=1..5} X_d p^d / d + sum_{d=4..5} X_s (d - s) p^d / (s d) ]
        //           + [ (X_l - X_s)/l + X_s/s ] p^l.
        string[] shorter = ["a", "b", "c"];
        string[] longer = ["c", "x", "a", "y", "b"];
        double seen = 2 * Math.Pow(0.8, 3) / 3 + 2 * Math.Pow(0.8, 4) / 4 + 3 * Math.Pow(0.8, 5) / 5;
        double padding = 2 * 1 * Math.Pow(0.8, 4) / (3 * 4) + 2 * 2 * Math.Pow(0.8, 5) / (3 * 5);
        double expected = 0.2 / 0.8 * (seen + padding) + (1.0 / 5 + 2.0 / 3) * Math.Pow(0.8, 5);
        Assert.Equal(expected, RankBiasedOverlap.Extrapolated<string>(shorter, longer, 0.8), 14);
        Assert.Equal(expected, RankBiasedOverlap.Extrapolated<string>(longer, shorter, 0.8), 14);
    }

    [Fact]
    public void Identical_lists_give_one_and_disjoint_lists_give_zero()
    {
        int[] list = [4, 9, 1, 7, 3, 8];
        Assert.Equal(1.0, RankBiasedOverlap.Extrapolated<int>(list, list, 0.9), 14);
        Assert.Equal(1 - Math.Pow(0.9, list.Length) + ResidualOfIdentical(0.9, list.Length), RankBiasedOverlap.Minimum<int>(list, list, 0.9), 12);
        Assert.Equal(0.0, RankBiasedOverlap.Extrapolated<int>(list, [10, 11, 12], 0.9));
        Assert.Equal(0.0, RankBiasedOverlap.Minimum<int>(list, [10, 11, 12, 13, 14, 15], 0.9));
        Assert.Equal(1 - Math.Pow(0.9, list.Length), RankBiasedOverlap.AtDepth<int>(list, list, 0.9, list.Length), 14);
    }

    [Fact]
    public void Bounds_are_ordered_prefix_minimum_extrapolated()
    {
        var random = new Random(9);
        for (int trial = 0; trial < 30; trial++)
        {
            var first = Enumerable.Range(0, 30).OrderBy(_ => random.Next()).Take(12).ToArray();
            var second = Enumerable.Range(0, 30).OrderBy(_ => random.Next()).Take(12).ToArray();
            double prefix = RankBiasedOverlap.AtDepth<int>(first, second, 0.9, 12);
            double minimum = RankBiasedOverlap.Minimum<int>(first, second, 0.9);
            double extrapolated = RankBiasedOverlap.Extrapolated<int>(first, second, 0.9);
            Assert.True(prefix <= minimum + 1e-15 && minimum <= extrapolated + 1e-15);
            Assert.True(extrapolated <= minimum + Math.Pow(0.9, 12) + 1e-12, "RBO_ext lies inside [RBO_min, RBO_min + p^k]");
        }
    }

    [Fact]
    public void Top_k_overlap_counts_shared_items_of_the_two_prefixes()
    {
        Assert.Equal(1.0, RankBiasedOverlap.TopOverlap<string>(First, Second, 2));
        Assert.Equal(2.0 / 3, RankBiasedOverlap.TopOverlap<string>(First, Second, 3), 15);
        Assert.Equal(0.75, RankBiasedOverlap.TopOverlap<string>(First, Second, 4));
    }

    [Fact]
    public void A_repeated_item_is_refused()
    {
        Assert.Throws<ArgumentException>(() => RankBiasedOverlap.Extrapolated<int>([1, 2, 1], [1, 2, 3], 0.9));
    }

    /// <summary>
    /// The part of RBO_min of identical lists of length k beyond depth k, where nothing more is known
    /// and the lower bound keeps X_d = k: (1-p)/p k sum_{d&gt;k} p^d / d.
    /// </summary>
    private static double ResidualOfIdentical(double p, int k)
    {
        double tail = -Math.Log(1 - p);
        for (int d = 1; d <= k; d++) tail -= Math.Pow(p, d) / d;
        return (1 - p) / p * k * tail;
    }
}
