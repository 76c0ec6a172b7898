namespace OmicsScreen.Screening.Statistics;

/// <summary>A two-sided Mann-Whitney (Wilcoxon rank-sum) test of a positive against a negative sample.</summary>
/// <param name="U">U of the positive sample: the number of (positive, negative) pairs with the positive higher, ties counted one half.</param>
/// <param name="Auc">U / (n1 n0) = P(X1 &gt; X0) + P(X1 = X0) / 2; below 0.5 when the negative sample is higher.</param>
/// <param name="Z">The continuity-corrected normal score of max(U, n1 n0 - U); 0 or below means no evidence.</param>
/// <param name="PValue">Two-sided p-value of the normal approximation with tie and continuity correction.</param>
public readonly record struct MannWhitneyResult(
    double U, double Auc, double Z, double PValue, int PositiveCount, int NegativeCount);
