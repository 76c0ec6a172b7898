namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// One shortlisted marker against one covariate: Spearman's rho for a numeric covariate, or
/// Kruskal-Wallis H with epsilon-squared for a categorical one; q is Benjamini-Hochberg over all
/// marker-covariate pairs of the run.
/// </summary>
/// <param name="Test">"spearman" or "kruskal_wallis".</param>
/// <param name="Effect">Spearman's rho, or epsilon-squared (0 to 1).</param>
public sealed record MarkerCovariateAssociation(int Feature, string Marker, string Covariate, string Test, double Effect, double PValue, double QValue);
