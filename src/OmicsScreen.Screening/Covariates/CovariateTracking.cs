namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// Which shortlisted markers only track a clinical covariate: every marker's association with every
/// covariate, and its importance marginal and conditional on each covariate against the decoys'.
/// </summary>
/// <param name="Covariates">The covariate names, in the order named.</param>
/// <param name="MarginalThreshold">Upper decile of the decoys' marginal importances: a marker above it is important.</param>
/// <param name="ConditionalThresholds">Upper decile of the decoys' importances conditional on each covariate.</param>
/// <param name="Decoys">Permuted copies of the markers grown beside them in the tracking forest.</param>
/// <param name="StrataPerNumericCovariate">Quantile strata a numeric covariate is cut into.</param>
public sealed record CovariateTracking(
    IReadOnlyList<string> Covariates, IReadOnlyList<MarkerCovariateAssociation> Associations, IReadOnlyList<MarkerTracking> Markers,
    double MarginalThreshold, IReadOnlyList<double> ConditionalThresholds, int Decoys, int StrataPerNumericCovariate)
{
    /// <summary>
    /// The out-of-bag loss the importances are measured in, as the screen's permutation importance
    /// of the outcome kind: "brier_increase" (classes), "squared_error_rise" (measured, squared
    /// outcome units) or "concordance_drop" (follow-up, Harrell's C).
    /// </summary>
    public string Loss { get; init; } = "brier_increase";

    /// <summary>The covariates a feature tracks; empty when it tracks none or is not shortlisted.</summary>
    public IReadOnlyList<string> TracksOf(int feature)
    {
        foreach (var marker in Markers)
            if (marker.Feature == feature) return marker.Tracks;
        return [];
    }
}
