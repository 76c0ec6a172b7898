namespace OmicsScreen.Screening.Statistics;

/// <summary>The standard error of an AUC by Hanley &amp; McNeil (1982, Radiology 143:29-36).</summary>
/// <remarks>
/// SE^2 = (A (1 - A) + (n1 - 1)(Q1 - A^2) + (n0 - 1)(Q2 - A^2)) / (n1 n0) with Q1 = A / (2 - A) and
/// Q2 = 2 A^2 / (1 + A), the exponential-model approximations of the paper's eq. 2; n1 counts the
/// positive (abnormal) and n0 the negative (normal) samples.
/// </remarks>
public static class HanleyMcNeil
{
    public static double StandardError(double auc, int positiveCount, int negativeCount)
    {
        if (positiveCount < 1 || negativeCount < 1 || double.IsNaN(auc)) return double.NaN;
        double q1 = auc / (2 - auc);
        double q2 = 2 * auc * auc / (1 + auc);
        double squared = auc * (1 - auc)
            + (positiveCount - 1) * (q1 - auc * auc)
            + (negativeCount - 1) * (q2 - auc * auc);
        return Math.Sqrt(Math.Max(0, squared) / ((double)positiveCount * negativeCount));
    }
}
