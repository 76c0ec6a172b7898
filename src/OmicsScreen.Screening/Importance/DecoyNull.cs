using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// p-values of features' importances against the same statistic of decoys: copies of real
/// features permuted once per run, grown beside them in every repeat. A decoy keeps its chance
/// association with the outcome in every repeat, as a null feature does, so a decoy's statistic
/// is a draw from the law of a null feature's statistic.
/// </summary>
/// <remarks>
/// p(x) = (1 + #{decoys &gt;= x}) / (1 + decoys), the Monte Carlo p-value (Davison &amp; Hinkley 1997,
/// eq. 4.11), valid when a null feature and the decoys are exchangeable. Where fewer than
/// <see cref="MinimumExceedances"/> decoys reach x, that count says little, so the p-value comes
/// from a generalized Pareto tail fitted to the largest decoys instead (Knijnenburg et al. 2009):
/// p(x) = (tail share) x P(Y &gt; x - threshold). This gives q-values the resolution to rank a list
/// when features outnumber decoys. P(Y &gt; y) is the fitted tail's one-sided 80% upper bound
/// (<see cref="GeneralizedParetoTailBound"/>), not its point value: carried past the largest decoys,
/// the point value came out too small often enough that null panels got lists in up to 19% of
/// runs at a false discovery rate of 0.10 (README, "How well the error control holds"). Below <see cref="MinimumTailFitCount"/> decoys no tail is fitted
/// and the plain Monte Carlo p-value is used throughout.
/// </remarks>
public static class DecoyNull
{
    /// <summary>Below this many decoys at or above a value, the tail fit replaces the count (Knijnenburg et al. 2009 use 10).</summary>
    public const int MinimumExceedances = 10;

    /// <summary>The largest number of decoys the tail is fitted to (Knijnenburg et al. 2009 start at 250).</summary>
    public const int MaximumTailCount = 250;

    /// <summary>Fewer decoys than this get no tail fit.</summary>
    public const int MinimumTailFitCount = 100;

    /// <summary>
    /// Each decoy's own p-value against the others, as a real feature's is computed against all
    /// decoys: the count leaves the decoy itself out, (1 + #{other decoys &gt;= x}) / (1 + decoys - 1),
    /// which is #{decoys &gt;= x} / decoys; the tail is the one fitted to all decoys.
    /// </summary>
    public static double[] DecoyPValues(ReadOnlySpan<double> decoyStatistics) => Compute(decoyStatistics, decoyStatistics, leaveSelfOut: true);

    public static double[] PValues(ReadOnlySpan<double> decoyStatistics, ReadOnlySpan<double> scored) => Compute(decoyStatistics, scored, leaveSelfOut: false);

    private static double[] Compute(ReadOnlySpan<double> decoyStatistics, ReadOnlySpan<double> scored, bool leaveSelfOut)
    {
        var pValues = new double[scored.Length];
        var sorted = new List<double>(decoyStatistics.Length);
        foreach (double value in decoyStatistics) if (!double.IsNaN(value)) sorted.Add(value);
        int decoyCount = sorted.Count;
        if (decoyCount == 0)
        {
            Array.Fill(pValues, double.NaN);
            return pValues;
        }
        var ascending = sorted.ToArray();
        Array.Sort(ascending);

        // The tail: the top tailCount decoys above a threshold halfway between the tailCount-th and
        // the next largest value (Knijnenburg et al. 2009).
        GeneralizedParetoTailBound? tail = null;
        double threshold = double.PositiveInfinity;
        int tailCount = Math.Min(MaximumTailCount, decoyCount / 4);
        if (decoyCount >= MinimumTailFitCount && tailCount >= 4)
        {
            threshold = 0.5 * (ascending[decoyCount - tailCount] + ascending[decoyCount - tailCount - 1]);
            var exceedances = new double[tailCount];
            for (int i = 0; i < tailCount; i++) exceedances[i] = ascending[decoyCount - tailCount + i] - threshold;
            tail = GeneralizedParetoTailBound.Fit(exceedances);
        }

        for (int i = 0; i < scored.Length; i++)
        {
            double value = scored[i];
            if (double.IsNaN(value))
            {
                pValues[i] = double.NaN;
                continue;
            }
            int atOrAbove = decoyCount - JanitzaNull.LowerBound(ascending, value);
            if (leaveSelfOut) atOrAbove--;
            int others = leaveSelfOut ? decoyCount - 1 : decoyCount;
            double monteCarlo = (1.0 + atOrAbove) / (1.0 + others);
            if (tail is not null && atOrAbove < MinimumExceedances && value > threshold)
                pValues[i] = Math.Min(monteCarlo, (double)tailCount / (1 + others) * tail.UpperSurvival(value - threshold));
            else pValues[i] = monteCarlo;
        }
        return pValues;
    }
}
