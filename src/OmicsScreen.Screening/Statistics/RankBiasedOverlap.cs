namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// Rank-biased overlap of two ranked lists (Webber, Moffat &amp; Zobel 2010, ACM TOIS 28(4):20), and the
/// plain top-k overlap.
/// </summary>
/// <remarks>
/// Lists hold distinct items, best first; they may have different lengths and need not share items.
/// X_d is the number of items the two depth-d prefixes share and A_d = X_d / d the agreement at depth
/// d. RBO = (1 - p) sum over d &gt;= 1 of p^(d-1) A_d (paper, eq. 7): the persistence p sets how
/// steeply weight falls with depth (the top d items carry 1 - p^d of it plus a share of the tail).
/// Finite lists only reveal a prefix of that sum, so the paper gives a lower bound (RBO_min, eq. 11)
/// and a point estimate that assumes agreement continues as seen (RBO_ext, eq. 30; eq. 32 for uneven
/// lists). For uneven lists X_d past the shorter list's end counts the items of the whole shorter
/// list found in the longer list's first d.
/// </remarks>
public static class RankBiasedOverlap
{
    /// <summary>
    /// The prefix sum (1 - p) sum_{d=1..depth} p^(d-1) A_d; prefixes past a list's end hold the whole list.
    /// It is the part of RBO that the top <paramref name="depth"/> ranks decide.
    /// </summary>
    public static double AtDepth<T>(ReadOnlySpan<T> first, ReadOnlySpan<T> second, double persistence, int depth)
        where T : notnull
    {
        CheckPersistence(persistence);
        if (depth < 1) throw new ArgumentOutOfRangeException(nameof(depth));
        var overlaps = OverlapProfile(first, second, depth);
        double sum = 0, weight = 1 - persistence;
        for (int d = 1; d <= depth; d++)
        {
            sum += weight * overlaps[d] / d;
            weight *= persistence;
        }
        return sum;
    }

    /// <summary>
    /// RBO_ext of the paper's eq. 32, with l the longer and s the shorter length:
    /// (1-p)/p [ sum_{d=1..l} X_d p^d / d + sum_{d=s+1..l} X_s (d - s) p^d / (s d) ] + [ (X_l - X_s)/l + X_s/s ] p^l.
    /// For even lists it reduces to eq. 30. Identical lists give 1 and disjoint lists 0.
    /// </summary>
    public static double Extrapolated<T>(ReadOnlySpan<T> first, ReadOnlySpan<T> second, double persistence)
        where T : notnull
    {
        CheckPersistence(persistence);
        int longer = Math.Max(first.Length, second.Length), shorter = Math.Min(first.Length, second.Length);
        if (shorter == 0) return 0;
        var overlaps = OverlapProfile(first, second, longer);
        double seen = 0, padding = 0, power = 1;
        for (int d = 1; d <= longer; d++)
        {
            power *= persistence;
            seen += overlaps[d] * power / d;
            if (d > shorter) padding += overlaps[shorter] * (d - shorter) * power / ((double)shorter * d);
        }
        double tail = ((overlaps[longer] - overlaps[shorter]) / (double)longer + overlaps[shorter] / (double)shorter) * power;
        return (1 - persistence) / persistence * (seen + padding) + tail;
    }

    /// <summary>
    /// The lower bound RBO_min: every item not yet seen is assumed to match nothing, so X_d stays at
    /// X_l beyond the longer list's end. For even lists of length k this is the paper's eq. 11,
    /// (1-p)/p [ sum_{d=1..k} (X_d - X_k) p^d / d - X_k ln(1 - p) ].
    /// </summary>
    public static double Minimum<T>(ReadOnlySpan<T> first, ReadOnlySpan<T> second, double persistence)
        where T : notnull
    {
        CheckPersistence(persistence);
        int longer = Math.Max(first.Length, second.Length);
        if (longer == 0) return 0;
        var overlaps = OverlapProfile(first, second, longer);
        double finalOverlap = overlaps[longer];
        double sum = 0, power = 1;
        for (int d = 1; d <= longer; d++)
        {
            power *= persistence;
            sum += (overlaps[d] - finalOverlap) * power / d;
        }
        return (1 - persistence) / persistence * (sum - finalOverlap * Math.Log(1 - persistence));
    }

    /// <summary>|first[..k] intersect second[..k]| / k; a list shorter than k contributes all its items.</summary>
    public static double TopOverlap<T>(ReadOnlySpan<T> first, ReadOnlySpan<T> second, int k) where T : notnull
    {
        if (k < 1) throw new ArgumentOutOfRangeException(nameof(k));
        return OverlapProfile(first, second, k)[k] / (double)k;
    }

    /// <summary>X_d for d = 0..depth (index d), the overlap of the two depth-d prefixes.</summary>
    private static int[] OverlapProfile<T>(ReadOnlySpan<T> first, ReadOnlySpan<T> second, int depth) where T : notnull
    {
        var overlaps = new int[depth + 1];
        var seenFirst = new HashSet<T>();
        var seenSecond = new HashSet<T>();
        int shared = 0;
        // Invariant: after step d, shared = |first[..d] intersect second[..d]|. Each new item is
        // counted once, when its partner is already seen; an item at the same depth in both lists is
        // counted when the second copy arrives.
        for (int d = 1; d <= depth; d++)
        {
            if (d <= first.Length)
            {
                var item = first[d - 1];
                if (!seenFirst.Add(item)) throw new ArgumentException($"Item {item} appears twice in the first list.", nameof(first));
                if (seenSecond.Contains(item)) shared++;
            }
            if (d <= second.Length)
            {
                var item = second[d - 1];
                if (!seenSecond.Add(item)) throw new ArgumentException($"Item {item} appears twice in the second list.", nameof(second));
                if (seenFirst.Contains(item)) shared++;
            }
            overlaps[d] = shared;
        }
        return overlaps;
    }

    private static void CheckPersistence(double persistence)
    {
        if (!(persistence > 0 && persistence < 1))
            throw new ArgumentOutOfRangeException(nameof(persistence), "Persistence must lie in (0, 1).");
    }
}
