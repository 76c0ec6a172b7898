namespace OmicsScreen.Screening.Statistics;

/// <summary>Ranks of a sample (1 = smallest) and the tie terms rank tests need.</summary>
public static class Ranking
{
    /// <summary>
    /// Writes the rank of every value (1-based, ascending) into <paramref name="ranks"/> and returns
    /// the tie term T = sum over runs of tied values of (t^3 - t), where t is the run length.
    /// </summary>
    /// <remarks>
    /// T is what the null variance of rank sums loses to ties: Var(U) = n1 n0 / 12 * ((N + 1) - T / (N (N - 1)))
    /// (Lehmann 1975, Nonparametrics, eq. 1.41). NaN values are rejected because they have no rank.
    /// </remarks>
    public static double Rank(ReadOnlySpan<double> values, Span<double> ranks, RankTies ties = RankTies.Average)
    {
        if (ranks.Length != values.Length) throw new ArgumentException("One rank slot is needed per value.", nameof(ranks));
        var sorted = new double[values.Length];
        var order = new int[values.Length];
        for (int i = 0; i < values.Length; i++)
        {
            if (double.IsNaN(values[i])) throw new ArgumentException("NaN has no rank.", nameof(values));
            sorted[i] = values[i];
            order[i] = i;
        }
        sorted.AsSpan().Sort(order.AsSpan());

        double tieTerm = 0;
        int start = 0, distinct = 0;
        // Invariant: positions [0, start) of the sorted order have their ranks written, in distinct runs.
        while (start < sorted.Length)
        {
            int end = start + 1;
            while (end < sorted.Length && sorted[end] == sorted[start]) end++;
            double rank = ties switch
            {
                RankTies.Average => (start + 1 + end) * 0.5,
                RankTies.Minimum => start + 1,
                RankTies.Maximum => end,
                RankTies.Dense => distinct + 1,
                _ => throw new ArgumentOutOfRangeException(nameof(ties)),
            };
            for (int k = start; k < end; k++) ranks[order[k]] = rank;
            double runLength = end - start;
            tieTerm += runLength * runLength * runLength - runLength;
            start = end;
            distinct++;
        }
        return tieTerm;
    }

    /// <summary>Ranks in a new array; see <see cref="Rank(ReadOnlySpan{double}, Span{double}, RankTies)"/>.</summary>
    public static double[] Rank(ReadOnlySpan<double> values, RankTies ties = RankTies.Average)
    {
        var ranks = new double[values.Length];
        Rank(values, ranks, ties);
        return ranks;
    }

    /// <summary>
    /// Indices of <paramref name="scores"/> best first: highest first or lowest first as
    /// <paramref name="direction"/> says, ties by index so the order never depends on the sort's
    /// stability, NaN (no score) last.
    /// </summary>
    public static int[] BestFirst(ReadOnlySpan<double> scores, ScoreDirection direction)
    {
        var keys = scores.ToArray();
        var order = new int[keys.Length];
        for (int i = 0; i < order.Length; i++) order[i] = i;
        bool higherIsBetter = direction == ScoreDirection.HigherIsBetter;
        Array.Sort(order, (a, b) =>
        {
            double x = keys[a], y = keys[b];
            bool xMissing = double.IsNaN(x), yMissing = double.IsNaN(y);
            if (xMissing != yMissing) return xMissing ? 1 : -1;
            if (!xMissing && x != y) return higherIsBetter ? y.CompareTo(x) : x.CompareTo(y);
            return a.CompareTo(b);
        });
        return order;
    }

    /// <summary>
    /// Ordinal ranks (1 = best, every rank used once): each value's place in
    /// <see cref="BestFirst"/>, so ties take consecutive ranks in index order and NaN ranks last.
    /// What a table's "rank by p-value" column needs, where <see cref="Rank(ReadOnlySpan{double}, RankTies)"/>
    /// gives the shared ranks a rank test needs.
    /// </summary>
    public static int[] OrdinalRanks(ReadOnlySpan<double> scores, ScoreDirection direction)
    {
        var order = BestFirst(scores, direction);
        var ranks = new int[order.Length];
        for (int place = 0; place < order.Length; place++) ranks[order[place]] = place + 1;
        return ranks;
    }

    /// <summary>The tie term T = sum of (t^3 - t) over runs of equal values in an ascending sample.</summary>
    public static double TieTermOfSorted(ReadOnlySpan<double> sortedValues)
    {
        double tieTerm = 0;
        int start = 0;
        while (start < sortedValues.Length)
        {
            int end = start + 1;
            while (end < sortedValues.Length && sortedValues[end] == sortedValues[start]) end++;
            double runLength = end - start;
            tieTerm += runLength * runLength * runLength - runLength;
            start = end;
        }
        return tieTerm;
    }
}
