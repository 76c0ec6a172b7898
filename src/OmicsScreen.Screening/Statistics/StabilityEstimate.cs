namespace OmicsScreen.Screening.Statistics;

/// <summary>The stability of a selection procedure with its sampling variance and interval.</summary>
/// <param name="Stability">Nogueira's estimate; 1 = every repeat selects the same set, about 0 = no better than random selections of the same sizes.</param>
/// <param name="Variance">Asymptotic variance of <paramref name="Stability"/>.</param>
/// <param name="Interval">Normal interval Stability +/- z sqrt(Variance).</param>
/// <param name="MeanSelectedCount">Mean number of features selected per repeat (k-bar).</param>
public readonly record struct StabilityEstimate(
    double Stability, double Variance, ConfidenceInterval Interval, double MeanSelectedCount, int RepeatCount, int FeatureCount);
