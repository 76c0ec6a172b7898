namespace OmicsScreen.Screening.Statistics;

/// <summary>An empirical AUC with the variance of its estimate.</summary>
/// <param name="Auc">P(X1 &gt; X0) + P(X1 = X0) / 2 over all (positive, negative) pairs.</param>
/// <param name="Variance">Estimated variance of <paramref name="Auc"/>; NaN when a class has fewer than two values.</param>
public readonly record struct AucEstimate(double Auc, double Variance, int PositiveCount, int NegativeCount)
{
    public double StandardError => Math.Sqrt(Variance);
}
