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
        var (positiveComponents, negativeComponents) = Components(positive, negative);
        return FromComponents(positiveComponents, negativeComponents);
    }

    /// <summary>
    /// Two AUCs measured on the same samples compared as DeLong et al. (1988) do for correlated ROC
    /// curves: the difference AUC_a - AUC_b, its variance from the covariance of the two scores'
    /// structural components, (S10_aa + S10_bb - 2 S10_ab) / n1 + (S01_aa + S01_bb - 2 S01_ab) / n0,
    /// a two-sided z test of no difference and a normal interval at <paramref name="level"/>.
    /// </summary>
    /// <param name="scoresA">First score per sample (higher = more likely positive).</param>
    /// <param name="scoresB">Second score per sample, same samples in the same order.</param>
    /// <param name="isPositive">The class of each sample.</param>
    public static PairedAucComparison ComparePaired(ReadOnlySpan<double> scoresA, ReadOnlySpan<double> scoresB,
        ReadOnlySpan<bool> isPositive, double level = 0.95)
    {
        if (scoresA.Length != isPositive.Length || scoresB.Length != isPositive.Length)
            throw new ArgumentException("Both scores and the classes need one value per sample.");
        var (positiveA, negativeA) = Split(scoresA, isPositive);
        var (positiveB, negativeB) = Split(scoresB, isPositive);
        int n1 = positiveA.Length, n0 = negativeA.Length;
        if (n1 < 2 || n0 < 2) throw new ArgumentException("A paired comparison needs at least two samples of each class.");
        var (v10a, v01a) = Components(positiveA, negativeA);
        var (v10b, v01b) = Components(positiveB, negativeB);
        double aucA = v10a.Average(), aucB = v10b.Average();
        double variance = (Covariance(v10a, v10a) + Covariance(v10b, v10b) - 2 * Covariance(v10a, v10b)) / n1
            + (Covariance(v01a, v01a) + Covariance(v01b, v01b) - 2 * Covariance(v01a, v01b)) / n0;
        double difference = aucA - aucB;
        double se = Math.Sqrt(Math.Max(variance, 0));
        double z = se > 0 ? difference / se : double.NaN;
        double p = se > 0 ? NormalTail.TwoSided(z) : double.NaN;
        double critical = NormalTail.TwoSidedCritical(level);
        var interval = se > 0 ? new ConfidenceInterval(difference - critical * se, difference + critical * se, level) : ConfidenceInterval.Undefined(level);
        return new PairedAucComparison(aucA, aucB, difference, se, z, p, interval, n1, n0);
    }

    private static (double[] Positive, double[] Negative) Split(ReadOnlySpan<double> scores, ReadOnlySpan<bool> isPositive)
    {
        var positive = new List<double>();
        var negative = new List<double>();
        for (int s = 0; s < scores.Length; s++) (isPositive[s] ? positive : negative).Add(scores[s]);
        return (positive.ToArray(), negative.ToArray());
    }

    /// <summary>Structural components V10 (per positive) and V01 (per negative) by midranks (Sun &amp; Xu 2014).</summary>
    private static (double[] Positive, double[] Negative) Components(ReadOnlySpan<double> positive, ReadOnlySpan<double> negative)
    {
        int n1 = positive.Length, n0 = negative.Length;
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
        return (positiveComponents, negativeComponents);
    }

    /// <summary>Sample covariance with divisor n - 1, as the components' variances.</summary>
    private static double Covariance(double[] x, double[] y)
    {
        double mx = x.Average(), my = y.Average(), sum = 0;
        for (int i = 0; i < x.Length; i++) sum += (x[i] - mx) * (y[i] - my);
        return sum / (x.Length - 1);
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
