namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Weights of the forest's p-value, the rank test's and the interaction scan's in the weighted
/// Cauchy combination (Liu &amp; Xie 2020 allow any non-negative weights; a test that did not run
/// drops out and the rest are renormalised). Any weights keep a screen's p-values valid, because
/// the combination is calibrated against the decoys' combinations computed with the same weights;
/// weights only move power between kinds of marker. When one test carries a marker, the combined
/// p-value is about that test's p-value divided by its share of the weight, so a share is the
/// factor a marker found by that test alone pays.
/// </summary>
internal sealed record CombinationWeights(double Forest, double RankTest, double InteractionScan)
{
    /// <summary>
    /// Forest and rank test alike, the scan a fifth: marginal shifts are by far the commonest
    /// signal in omics panels, and a pair the scan finds keeps a scan p-value so small that a fifth
    /// of the weight still carries it (calibration suite, README).
    /// </summary>
    public static CombinationWeights Even { get; } = new(0.4, 0.4, 0.2);
}
