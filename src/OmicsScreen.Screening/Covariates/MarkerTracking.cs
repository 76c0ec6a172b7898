namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// A shortlisted marker's out-of-bag permutation importance in the tracking forest (the
/// outcome kind's loss, <see cref="CovariateTracking.Loss"/>): marginal, and conditional on each covariate (permuted only within the
/// covariate's strata), with the covariates whose conditioning takes it down to the decoys' level.
/// </summary>
/// <param name="Conditional">Conditional importance per covariate, in the covariates' order.</param>
/// <param name="Tracks">The covariates the marker tracks: its marginal importance is above the decoys' threshold and its importance conditional on the covariate is not.</param>
public sealed record MarkerTracking(int Feature, string Marker, double Marginal, IReadOnlyList<double> Conditional, IReadOnlyList<string> Tracks);
