using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Screen;

public sealed class ShortlistSelectionTests
{
    /// <summary>A feature with only what the rule reads: frequency, p-value and q-value.</summary>
    private static FeatureSummary Feature(int index, double frequency, double p, double q) =>
        new(index, $"F{index}", frequency, 1, 1, 1, 0, 0, 0, 0, 0, 0, p, double.NaN, p, q, index + 1);

    // Ten features and five decoys (two features per decoy). Hand-worked:
    //   features' p: 0.001 0.002 0.003 0.004 0.02 0.03 0.2 0.4 0.6 0.9
    //   decoys' p:   0.0035 0.05 0.3 0.5 0.8
    private static readonly double[] FeatureP = [0.001, 0.002, 0.003, 0.004, 0.02, 0.03, 0.2, 0.4, 0.6, 0.9];
    private static readonly DecoyEvidence Decoys = new([0, 0, 0, 0, 0], [1, 1, 1, 1, 1], [0.0035, 0.05, 0.3, 0.5, 0.8], [0.0035, 0.05, 0.3, 0.5, 0.8]);

    private static FeatureSummary[] Features(double[] qValues) =>
        FeatureP.Select((p, i) => Feature(i, 1, p, qValues[i])).ToArray();

    [Fact]
    public void The_decoy_estimate_counts_decoys_under_the_lists_largest_p_value_and_scales_them()
    {
        // A list of the first six (largest p 0.03): decoys at or under 0.03: one (0.0035).
        // Features per decoy 10/5 = 2, so about 2 x 1 = 2 false markers, FDR estimate 2/6, and
        // with the +1 of knockoff+ (Barber & Candès 2015) 2 x (1 + 1)/6 = 2/3.
        var features = Features([0.01, 0.01, 0.01, 0.01, 0.04, 0.05, 0.4, 0.6, 0.7, 0.9]);
        var (list, estimate) = ShortlistSelection.Apply(features, Enumerable.Range(0, 10).ToArray(), Decoys, new ScreenOptions { QValueThreshold = 0.05 });
        Assert.Equal([0, 1, 2, 3, 4, 5], list);
        Assert.Equal(1, estimate.DecoysPassing);
        Assert.Equal(2.0, estimate.FeaturesPerDecoy, 12);
        Assert.Equal(2.0, estimate.ExpectedFalseMarkers, 12);
        Assert.Equal(2.0 / 6, estimate.EstimatedFalseDiscoveryRate, 12);
        Assert.Equal(2.0 / 3, estimate.FalseDiscoveryBound, 12);
    }

    [Fact]
    public void The_decoy_bound_rule_keeps_the_longest_list_whose_knockoff_plus_bound_is_under_the_level()
    {
        // Cuts at each feature p-value: R = 1..10, decoys at or under D, bound 2 (1 + D)/R:
        //   R=3 (0.003): D=0 -> 0.667; R=4 (0.004): D=1 -> 1.0; R=6 (0.03): D=1 -> 0.667;
        //   R=7 (0.2): D=2 -> 0.857; R=10: D=5 -> 1.2.
        // At level 0.7 the longest list is R = 6 (bound 0.667); at level 0.5 none qualifies.
        var features = Features(Enumerable.Repeat(1.0, 10).ToArray());
        var (list, _) = ShortlistSelection.Apply(features, Enumerable.Range(0, 10).ToArray(), Decoys,
            new ScreenOptions { Rule = ShortlistRule.DecoyBound, QValueThreshold = 0.7 });
        Assert.Equal([0, 1, 2, 3, 4, 5], list);
        var (none, estimate) = ShortlistSelection.Apply(features, Enumerable.Range(0, 10).ToArray(), Decoys,
            new ScreenOptions { Rule = ShortlistRule.DecoyBound, QValueThreshold = 0.5 });
        Assert.Empty(none);
        Assert.Equal(0, estimate.EstimatedFalseDiscoveryRate);
    }

    [Fact]
    public void A_frequency_filter_applies_to_features_and_decoys_alike()
    {
        var features = FeatureP.Select((p, i) => Feature(i, i == 1 ? 0.4 : 0.9, p, 0.01)).ToArray();
        var decoys = Decoys with { Frequencies = [0.3, 1, 1, 1, 1] };
        var (list, estimate) = ShortlistSelection.Apply(features, Enumerable.Range(0, 10).ToArray(), decoys,
            new ScreenOptions { FrequencyThreshold = 0.6, QValueThreshold = 0.05 });
        Assert.DoesNotContain(1, list);
        Assert.Equal(9, list.Length);
        // The one decoy under every cut (0.0035) is filtered out; 0.05, 0.3, 0.5, 0.8 are under
        // the list's largest p (0.9).
        Assert.Equal(4, estimate.DecoysPassing);
    }
}
