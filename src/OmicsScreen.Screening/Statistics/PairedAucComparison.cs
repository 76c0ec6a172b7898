namespace OmicsScreen.Screening.Statistics;

/// <summary>Two AUCs on the same samples compared by DeLong et al. (1988): see <see cref="DeLong.ComparePaired"/>.</summary>
/// <param name="Difference">AUC of the first score minus AUC of the second.</param>
/// <param name="StandardError">Standard error of the difference, from the covariance of the structural components.</param>
/// <param name="Z">Difference over its standard error; NaN when the standard error is 0.</param>
/// <param name="PValue">Two-sided p-value of no difference.</param>
/// <param name="Interval">Normal interval of the difference.</param>
public sealed record PairedAucComparison(
    double AucA, double AucB, double Difference, double StandardError, double Z, double PValue, ConfidenceInterval Interval,
    int PositiveCount, int NegativeCount);
