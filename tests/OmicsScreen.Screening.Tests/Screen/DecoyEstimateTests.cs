using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Screen;

/// <summary>
/// The edges of the target-decoy estimate (ShortlistSelection.Estimate; Elias &amp; Gygi 2007 for
/// the estimate, Barber &amp; Candès 2015 for the +1 of the bound); the worked middle case is in
/// <see cref="ShortlistSelectionTests"/>.
/// </summary>
public sealed class DecoyEstimateTests
{
    private static FeatureSummary Feature(int index, double p) =>
        new(index, $"F{index}", 1, 1, 1, 1, 0, 0, 0, 0, 0, 0, p, double.NaN, p, p, index + 1);

    private static readonly FeatureSummary[] Features = [Feature(0, 0.001), Feature(1, 0.01), Feature(2, 0.02), Feature(3, 0.5)];

    [Fact]
    public void Without_decoys_there_is_no_estimate()
    {
        var estimate = ShortlistSelection.Estimate(Features, [0, 1], DecoyEvidence.None, new ScreenOptions());
        Assert.Equal((0, 0, 2), (estimate.DecoyCount, estimate.DecoysPassing, estimate.Shortlisted));
        Assert.True(double.IsNaN(estimate.EstimatedFalseDiscoveryRate));
        Assert.True(double.IsNaN(estimate.FalseDiscoveryBound));
    }

    [Fact]
    public void An_empty_list_has_rate_zero_and_no_bound()
    {
        var decoys = new DecoyEvidence([0, 0], [1, 1], [0.0001, 0.3], [0.0001, 0.3]);
        var estimate = ShortlistSelection.Estimate(Features, [], decoys, new ScreenOptions());
        Assert.Equal(0, estimate.DecoysPassing);
        Assert.Equal(0, estimate.EstimatedFalseDiscoveryRate);
        Assert.True(double.IsNaN(estimate.FalseDiscoveryBound));
        Assert.Equal(2.0, estimate.FeaturesPerDecoy, 12);
    }

    [Fact]
    public void Rate_and_bound_are_capped_at_one_and_a_decoy_at_the_cut_passes()
    {
        // List {0, 1}: cut 0.01. Two decoys at or under it (0.0001 and exactly 0.01), 4/2 = 2 features
        // per decoy: 2 x 2 = 4 expected false markers on a list of 2, so the rate is min(1, 2) = 1;
        // bound min(1, 2 x 3 / 2) = 1.
        var decoys = new DecoyEvidence([0, 0], [1, 1], [0.0001, 0.01], [0.0001, 0.01]);
        var estimate = ShortlistSelection.Estimate(Features, [0, 1], decoys, new ScreenOptions());
        Assert.Equal(2, estimate.DecoysPassing);
        Assert.Equal(4.0, estimate.ExpectedFalseMarkers, 12);
        Assert.Equal(1.0, estimate.EstimatedFalseDiscoveryRate);
        Assert.Equal(1.0, estimate.FalseDiscoveryBound);
    }
}
