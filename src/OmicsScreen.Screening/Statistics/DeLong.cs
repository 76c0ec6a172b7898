namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// The AUC and its variance by DeLong, DeLong &amp; Clarke-Pearson (1988), from structural components.
/// </summary>
/// <remarks>
/// With psi(x, y) = 1 if x &gt; y, 1/2 if x = y, 0 otherwise, the structural components are
/// V10(i) = mean over negatives j of psi(X_i, Y_j) and V01(j) = mean over positives i of psi(X_i, Y_j);
/// AUC = mean V10 = mean V01, and Var(AUC) = S10 / n1 + S01 / n0 with S10, S01 the sample variances
/// (divisor n - 1) of the components. Sun &amp; Xu (2014, IEEE Signal Processing Letters 21:1389) show that
/// V10(i) = (R_i - R_i^pos) / n0 and V01(j) = 1 - (R_j - R_j^neg) / n1, where R is the midrank in the
/// pooled sample and R^pos, R^neg the midrank within the own class, which gives O(N log N).
/// NaN values are rejected.
/// </remarks>
public static class DeLong
{
    /// <summary>The fast midrank computation of Sun &amp; Xu (2014).</summary>
    public static AucEstimate Estimate(ReadOnlySpan<double> positive, ReadOnlySpan<double> negative)
    {
        int n1 = positive.Length, n0 = negative.Length;
        if (n1 == 0 || n0 == 0) return new AucEstimate(double.NaN, double.NaN, n1, n0);
        var pooled = new double[n1 + n0];
        positive.CopyTo(pooled);
        negative.CopyTo(pooled.AsSpan(n1));
        var pooledRanks = Ranking.Rank(pooled);
        var positiveRanks = Ranking.Rank(positive);
        var negativeRanks = Ranking.Rank(negative);

        var positiveComponents = new double[n1];
        for (int i = 0; i < n1; i++) positiveComponents[i] = (pooledRanks[i] - positiveRanks[i]) / n0;
        var negativeComponents = new double[n0];
        for (int j = 0; j < n0; j++) negativeComponents[j] = 1.0 - (pooledRanks[n1 + j] - negativeRanks[j]) / n1;
        return FromComponents(positiveComponents, negativeComponents);
    }

    /// <summary>The plain O(n1 n0) computation straight from the definition; for tests and small samples.</summary>
    public static AucEstimate EstimateByPairs(ReadOnlySpan<double> positive, ReadOnlySpan<double> negative)
    {
        int n1 = positive.Length, n0 = negative.Length;
        if (n1 == 0 || n0 == 0) return new AucEstimate(double.NaN, double.NaN, n1, n0);
        var positiveComponents = new double[n1];
        var negativeComponents = new double[n0];
        for (int i = 0; i < n1; i++)
        {
            if (double.IsNaN(positive[i])) throw new ArgumentException("NaN values are not allowed.", nameof(positive));
            for (int j = 0; j < n0; j++)
            {
                if (double.IsNaN(negative[j])) throw new ArgumentException("NaN values are not allowed.", nameof(negative));
                double psi = positive[i] > negative[j] ? 1.0 : positive[i] == negative[j] ? 0.5 : 0.0;
                positiveComponents[i] += psi;
                negativeComponents[j] += psi;
            }
        }
        for (int i = 0; i < n1; i++) positiveComponents[i] /= n0;
        for (int j = 0; j < n0; j++) negativeComponents[j] /= n1;
        return FromComponents(positiveComponents, negativeComponents);
    }

    private static AucEstimate FromComponents(double[] positiveComponents, double[] negativeComponents)
    {
        int n1 = positiveComponents.Length, n0 = negativeComponents.Length;
        double auc = 0;
        foreach (double v in positiveComponents) auc += v;
        auc /= n1;
        if (n1 < 2 || n0 < 2) return new AucEstimate(auc, double.NaN, n1, n0);
        var (_, s10) = WelchTest.MeanAndVariance(positiveComponents);
        var (_, s01) = WelchTest.MeanAndVariance(negativeComponents);
        return new AucEstimate(auc, s10 / n1 + s01 / n0, n1, n0);
    }
}
