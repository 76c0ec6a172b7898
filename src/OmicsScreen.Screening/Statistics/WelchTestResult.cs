namespace OmicsScreen.Screening.Statistics;

/// <summary>Welch's unequal-variance t-test of the first sample's mean against the second's.</summary>
/// <param name="T">(mean1 - mean0) / sqrt(s1^2/n1 + s0^2/n0), sample variances with n - 1.</param>
/// <param name="DegreesOfFreedom">Welch-Satterthwaite degrees of freedom.</param>
/// <param name="PValue">Two-sided p-value from Student's t with those degrees of freedom.</param>
public readonly record struct WelchTestResult(
    double T, double DegreesOfFreedom, double PValue, double MeanDifference, double StandardError);
