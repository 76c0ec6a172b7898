namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Target-decoy estimate of how many shortlisted markers are noise. Decoys are copies of real
/// features permuted once per run and screened beside them, so a decoy passing the shortlist's
/// rule stands for a null feature passing it (target-decoy reasoning, Elias &amp; Gygi 2007, Nature
/// Methods 4(3)). Scaled from decoys to features: each passing decoy stands for
/// <see cref="FeaturesPerDecoy"/> null features.
/// </summary>
/// <param name="DecoysPassing">Decoys whose selection frequency and mean corrected importance reach the shortlist's cut.</param>
/// <param name="EstimatedFalseDiscoveryRate">min(1, features/decoys x decoys passing / shortlisted); 0 for an empty list; NaN without decoys.</param>
public sealed record DecoyEstimate(int DecoyCount, int DecoysPassing, int Shortlisted, double EstimatedFalseDiscoveryRate)
{
    /// <summary>Real features per decoy: the factor from decoys passing to null features passing.</summary>
    public double FeaturesPerDecoy { get; init; } = double.NaN;

    /// <summary>features/decoys x decoys passing: the expected number of false markers on the list.</summary>
    public double ExpectedFalseMarkers { get; init; } = double.NaN;

    /// <summary>
    /// min(1, features/decoys x (1 + decoys passing) / shortlisted): the estimate with the +1 of the
    /// knockoff+ filter (Barber &amp; Candès 2015, Ann Stat 43(5)), which errs high, so a list cut at
    /// this bound keeps its false discovery rate under the level. NaN for an empty list or without decoys.
    /// </summary>
    public double FalseDiscoveryBound { get; init; } = double.NaN;
}
