namespace OmicsScreen.Screening.Statistics;

/// <summary>Normal-approximation confidence intervals for an AUC from its standard error.</summary>
public static class AucInterval
{
    /// <summary>
    /// The interval at <paramref name="level"/> (0.95 gives 95%) on the chosen scale; the default
    /// <see cref="AucIntervalScale.Probability"/> is clipped to [0, 1]. On the logit scale an AUC of
    /// exactly 0 or 1 has no finite logit, so the interval collapses to that point.
    /// </summary>
    public static ConfidenceInterval Compute(double auc, double standardError, double level = 0.95,
        AucIntervalScale scale = AucIntervalScale.Probability) =>
        Compute(auc, standardError, level, NormalTail.TwoSidedCritical(level), scale);

    /// <summary>As above with the normal critical value already known, for per-feature loops.</summary>
    internal static ConfidenceInterval Compute(double auc, double standardError, double level, double critical,
        AucIntervalScale scale)
    {
        if (double.IsNaN(auc) || double.IsNaN(standardError)) return ConfidenceInterval.Undefined(level);
        if (scale == AucIntervalScale.Probability)
            return new ConfidenceInterval(Math.Max(0, auc - critical * standardError),
                Math.Min(1, auc + critical * standardError), level);
        if (auc <= 0 || auc >= 1) return new ConfidenceInterval(auc, auc, level);
        double logit = Math.Log(auc / (1 - auc));
        double halfWidth = critical * standardError / (auc * (1 - auc));
        return new ConfidenceInterval(Logistic(logit - halfWidth), Logistic(logit + halfWidth), level);
    }

    private static double Logistic(double x) => 1.0 / (1.0 + Math.Exp(-x));
}
