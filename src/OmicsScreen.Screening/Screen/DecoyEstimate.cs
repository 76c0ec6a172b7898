namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Target-decoy estimate of the shortlist's false discovery rate: decoys are permuted copies of
/// real features, so the share of decoys passing the shortlist rule, scaled to the number of real
/// features, estimates how many shortlisted features are noise (in the spirit of Elias &amp; Gygi
/// 2007, Nature Methods 4(3), for peptide identifications).
/// </summary>
/// <param name="EstimatedFalseDiscoveryRate">min(1, (decoys passing / decoys) x features / max(1, shortlisted)); NaN without decoys.</param>
public sealed record DecoyEstimate(int DecoyCount, int DecoysPassing, int Shortlisted, double EstimatedFalseDiscoveryRate);
