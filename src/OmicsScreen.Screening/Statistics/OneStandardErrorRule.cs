namespace OmicsScreen.Screening.Statistics;

/// <summary>The one-standard-error rule of Breiman, Friedman, Olshen &amp; Stone (1984, Classification and Regression Trees, sec. 3.4.3).</summary>
/// <remarks>
/// Among candidate sizes k with mean score m_k and standard error se_k, take the best mean m*
/// (ties to the smaller k) and choose the smallest k whose mean is within one standard error of
/// it: m_k &gt;= m* - se* when higher is better, m_k &lt;= m* + se* when lower is better. The simpler
/// model is preferred unless the data show the larger one is clearly better.
/// NaN means are skipped; a NaN standard error of the best counts as 0.
/// </remarks>
public static class OneStandardErrorRule
{
    /// <summary>The index (into the three spans) of the chosen size; -1 when every mean is NaN.</summary>
    public static int Choose(ReadOnlySpan<int> sizes, ReadOnlySpan<double> means, ReadOnlySpan<double> standardErrors,
        ScoreDirection direction)
    {
        if (means.Length != sizes.Length || standardErrors.Length != sizes.Length)
            throw new ArgumentException("Sizes, means and standard errors must have one entry per candidate.");
        double sign = direction == ScoreDirection.HigherIsBetter ? 1 : -1;
        int best = -1;
        for (int i = 0; i < sizes.Length; i++)
        {
            if (double.IsNaN(means[i])) continue;
            if (best < 0 || sign * means[i] > sign * means[best] || (means[i] == means[best] && sizes[i] < sizes[best]))
                best = i;
        }
        if (best < 0) return -1;
        double bestError = double.IsNaN(standardErrors[best]) ? 0 : standardErrors[best];
        double threshold = sign * means[best] - bestError;
        int chosen = best;
        for (int i = 0; i < sizes.Length; i++)
        {
            if (double.IsNaN(means[i]) || sign * means[i] < threshold) continue;
            if (sizes[i] < sizes[chosen]) chosen = i;
        }
        return chosen;
    }
}
