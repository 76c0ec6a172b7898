namespace OmicsScreen.Screening.Statistics;

/// <summary>A Kruskal-Wallis test: H (tie-corrected), its degrees of freedom and p-value, epsilon-squared, and the samples used.</summary>
public readonly record struct KruskalWallisResult(double H, int DegreesOfFreedom, double PValue, double EpsilonSquared, int SampleCount);
