namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>Harrell's C with its pair counts and an interval.</summary>
/// <param name="Concordance">Share of comparable pairs in which the sample with the higher score had the event first (ties in the score count one half).</param>
/// <param name="StandardError">Infinitesimal-jackknife standard error (the variance R's survival package reports for <c>concordance</c>).</param>
public readonly record struct ConcordanceEstimate(
    double Concordance, double StandardError, ConfidenceInterval Interval,
    long Concordant, long Discordant, long TiedScore)
{
    public long ComparablePairs => Concordant + Discordant + TiedScore;
}

/// <summary>
/// Harrell's concordance index (Harrell, Califf, Pryor, Lee & Rosati 1982) of a risk score against
/// censored follow-up: a pair is comparable when the sample with the shorter time had the event
/// (a sample censored at the same time as an event is taken to outlive it; two events at the same
/// time are not comparable). Counted in O(n log n) with two sweeps over the times and Fenwick trees
/// on the score's ranks, so it scales to thousands of samples per marker.
/// </summary>
public static class HarrellConcordance
{
    /// <param name="riskScore">Higher means earlier events expected (a hazard, not a survival time).</param>
    public static ConcordanceEstimate Estimate(
        ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved, ReadOnlySpan<double> riskScore, double level = 0.95)
    {
        FollowUp.Check(time, eventObserved);
        if (riskScore.Length != time.Length) throw new ArgumentException("The score needs one value per sample.");
        int n = time.Length;
        var scoreRank = DenseRanks(riskScore, out int distinct);
        var order = FollowUp.OrderByTime(time);

        // Per sample: the pairs it is part of (n_k) and their concordance credit (a_k); the
        // infinitesimal jackknife variance is sum_k ((a_k - C n_k) / N)^2 (Therneau & Watson 2017).
        var credit = new double[n];
        var pairs = new double[n];
        long concordant = 0, discordant = 0, tied = 0;

        // Sweep 1, from the latest time down: each event against the samples that outlive it.
        var later = new Fenwick(distinct);
        int end = n;
        while (end > 0)
        {
            int start = end - 1;
            while (start > 0 && time[order[start - 1]] == time[order[end - 1]]) start--;
            for (int p = start; p < end; p++)
                if (!eventObserved[order[p]]) later.Add(scoreRank[order[p]]);
            for (int p = start; p < end; p++)
            {
                int sample = order[p];
                if (!eventObserved[sample]) continue;
                int rank = scoreRank[sample];
                long lower = later.PrefixCount(rank - 1), same = later.Count(rank), total = later.Total;
                concordant += lower;
                tied += same;
                discordant += total - lower - same;
                credit[sample] += lower + 0.5 * same;
                pairs[sample] += total;
            }
            for (int p = start; p < end; p++)
                if (eventObserved[order[p]]) later.Add(scoreRank[order[p]]);
            end = start;
        }

        // Sweep 2, from the earliest time up: each sample against the events it outlived.
        var earlierEvents = new Fenwick(distinct);
        int begin = 0;
        while (begin < n)
        {
            int stop = begin + 1;
            while (stop < n && time[order[stop]] == time[order[begin]]) stop++;
            for (int p = begin; p < stop; p++)
                if (eventObserved[order[p]]) CreditAsSurvivor(order[p]);
            for (int p = begin; p < stop; p++)
                if (eventObserved[order[p]]) earlierEvents.Add(scoreRank[order[p]]);
            for (int p = begin; p < stop; p++)
                if (!eventObserved[order[p]]) CreditAsSurvivor(order[p]);
            begin = stop;
        }

        long comparable = concordant + discordant + tied;
        if (comparable == 0)
            return new ConcordanceEstimate(double.NaN, double.NaN, ConfidenceInterval.Undefined(level), 0, 0, 0);
        double c = (concordant + 0.5 * tied) / comparable;
        double variance = 0;
        for (int k = 0; k < n; k++)
        {
            double influence = (credit[k] - c * pairs[k]) / comparable;
            variance += influence * influence;
        }
        double se = Math.Sqrt(variance);
        double z = NormalTail.TwoSidedCritical(level);
        var interval = new ConfidenceInterval(Math.Max(0, c - z * se), Math.Min(1, c + z * se), level);
        return new ConcordanceEstimate(c, se, interval, concordant, discordant, tied);

        void CreditAsSurvivor(int sample)
        {
            int rank = scoreRank[sample];
            long atOrBelow = earlierEvents.PrefixCount(rank), same = earlierEvents.Count(rank), total = earlierEvents.Total;
            credit[sample] += total - atOrBelow + 0.5 * same;
            pairs[sample] += total;
        }
    }

    /// <summary>0-based dense ranks (the Fenwick trees' index) and the number of distinct values.</summary>
    private static int[] DenseRanks(ReadOnlySpan<double> values, out int distinct)
    {
        foreach (double v in values)
            if (double.IsNaN(v)) throw new ArgumentException("The score has a missing value; drop those samples first.");
        var dense = Ranking.Rank(values, RankTies.Dense);
        var ranks = new int[values.Length];
        distinct = 0;
        for (int i = 0; i < values.Length; i++)
        {
            ranks[i] = (int)dense[i] - 1;
            distinct = Math.Max(distinct, ranks[i] + 1);
        }
        return ranks;
    }

    /// <summary>Counts of inserted ranks with prefix sums in O(log n) (Fenwick 1994).</summary>
    private sealed class Fenwick(int size)
    {
        private readonly long[] _tree = new long[size + 1];
        public long Total { get; private set; }

        public void Add(int rank)
        {
            Total++;
            for (int i = rank + 1; i < _tree.Length; i += i & -i) _tree[i]++;
        }

        /// <summary>How many inserted ranks are at or below <paramref name="rank"/> (0 for rank -1).</summary>
        public long PrefixCount(int rank)
        {
            long sum = 0;
            for (int i = rank + 1; i > 0; i -= i & -i) sum += _tree[i];
            return sum;
        }

        public long Count(int rank) => PrefixCount(rank) - PrefixCount(rank - 1);
    }
}
