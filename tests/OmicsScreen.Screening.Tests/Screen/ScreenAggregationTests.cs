using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Screen;

/// <summary>
/// ScreenAggregation on a hand-made 4 repeats x 4 features matrix, every summary worked by hand:
/// quartiles by the linear definition (Hyndman &amp; Fan 1996 type 7, R's default: h = (n-1)p,
/// x[floor h] + (h - floor h)(x[floor h + 1] - x[floor h])), SDs with n - 1, BH q-values by the
/// step-up rule of Benjamini &amp; Hochberg (1995).
/// </summary>
public sealed class ScreenAggregationTests
{
    private static RepeatImportances Repeats()
    {
        var repeats = new RepeatImportances(4, 4, 0);
        double[][] corrected = [[0.5, 0.1, -0.1, 0.0], [0.3, 0.2, -0.2, 0.0], [0.4, 0.3, 0.0, 0.0], [0.6, 0.2, 0.1, 0.0]];
        double[][] permutation = [[0.02, 0.01, 0, 0], [0.04, 0.01, 0, 0], [0.03, 0.02, 0, 0], [0.03, 0.00, 0, 0]];
        double[][] ranks = [[1, 2, 4, 3], [1, 2, 4, 3], [2, 1, 3, 4], [1, 3, 2, 4]];
        bool[][] selected = [[true, true, false, false], [true, false, true, false], [true, true, false, false], [true, false, true, false]];
        for (int r = 0; r < 4; r++)
        {
            corrected[r].CopyTo(repeats.Row(repeats.Corrected, r));
            permutation[r].CopyTo(repeats.Row(repeats.Permutation, r));
            ranks[r].CopyTo(repeats.Row(repeats.CombinedRank, r));
            for (int f = 0; f < 4; f++) repeats.Selected[r * 4 + f] = selected[r][f];
        }
        return repeats;
    }

    private static readonly DirectTestEvidence NoDirectTests = new([], [], [], [], []);

    /// <summary>Outcome-permutation p-values given, so the forest's p-value is known exactly.</summary>
    private static FeatureSummary[] Summarise() =>
        ScreenAggregation.Summarise(Repeats(), ["f0", "f1", "f2", "f3"], DecoyEvidence.None, [0.01, 0.2, 0.95, 0.5], NoDirectTests);

    [Fact]
    public void Frequencies_quartiles_means_and_sds_are_views_of_the_repeats()
    {
        var features = Summarise();
        Assert.Equal([1.0, 0.5, 0.5, 0.0], features.Select(f => f.SelectionFrequency));
        // f0's combined ranks sorted 1 1 1 2: median (h = 1.5) 1, Q1 (h = 0.75) 1, Q3 (h = 2.25) 1 + 0.25 x 1 = 1.25.
        Assert.Equal((1.0, 1.0, 1.25), (features[0].MedianRank, features[0].RankLowerQuartile, features[0].RankUpperQuartile));
        // f1's 1 2 2 3: median 2, Q1 1 + 0.75 x 1 = 1.75, Q3 2 + 0.25 x 1 = 2.25.
        Assert.Equal((2.0, 1.75, 2.25), (features[1].MedianRank, features[1].RankLowerQuartile, features[1].RankUpperQuartile));
        // f0's corrected importances 0.5 0.3 0.4 0.6: mean 0.45, squares 0.05, SD sqrt(0.05/3).
        Assert.Equal(0.45, features[0].CorrectedMean, 12);
        Assert.Equal(Math.Sqrt(0.05 / 3), features[0].CorrectedSd, 12);
        Assert.Equal(0.03, features[0].PermutationMean, 12);
        Assert.Equal(0.0, features[3].CorrectedSd, 12);
    }

    [Fact]
    public void A_single_test_passes_through_the_combination_capped_and_q_values_follow_bh()
    {
        var features = Summarise();
        // With the forest's evidence alone the Cauchy combination returns it (Liu & Xie 2020, one
        // weight), capped at 0.9 (ScreenAggregation.CombinationCap): 0.95 -> 0.9.
        Assert.Equal([0.01, 0.2, 0.9, 0.5], features.Select(f => Math.Round(f.PValue, 12)));
        Assert.Equal([0.01, 0.2, 0.95, 0.5], features.Select(f => f.ForestP));
        Assert.Equal([0.01, 0.2, 0.95, 0.5], features.Select(f => f.OutcomePermutationP));
        // BH on 0.01 0.2 0.5 0.9 (m = 4): 0.9; min(0.9, 0.5 x 4/3); min(0.667, 0.2 x 4/2) = 0.4; min(0.4, 0.01 x 4) = 0.04.
        Assert.Equal(0.04, features[0].QValue, 12);
        Assert.Equal(0.4, features[1].QValue, 12);
        Assert.Equal(0.9, features[2].QValue, 12);
        Assert.Equal(0.5 * 4 / 3, features[3].QValue, 12);
        Assert.True(double.IsNaN(features[0].RankTestP));
        Assert.Equal(-1, features[0].InteractionPartner);
    }

    [Fact]
    public void The_order_is_frequency_then_median_rank_then_mean_importance_then_feature_index()
    {
        var features = Summarise();
        // f0 (frequency 1), then f1 and f2 (0.5; median ranks 2 and 3.5), then f3.
        Assert.Equal([0, 1, 2, 3], ScreenAggregation.OrderOf(features));
        Assert.Equal([1, 2, 3, 4], features.Select(f => f.Order));
        // Ties: equal frequencies; f3 has the smallest median rank; f1 and f2 tie on median and
        // mean, so the feature index decides; f0 has the smallest mean of the median-2 features.
        Assert.Equal([3, 1, 2, 0], ScreenAggregation.FinalOrder([0.5, 0.5, 0.5, 0.5], [2, 2, 2, 1], [0.1, 0.3, 0.3, 0]));
    }

    [Fact]
    public void Without_permutations_or_decoys_the_forest_p_value_is_the_mirrored_null()
    {
        var features = ScreenAggregation.Summarise(Repeats(), ["f0", "f1", "f2", "f3"], DecoyEvidence.None, [], NoDirectTests);
        Assert.All(features, f => Assert.Equal(f.NullP, f.ForestP));
        Assert.All(features, f => Assert.True(double.IsNaN(f.OutcomePermutationP)));
        // The strongest feature's mean (0.45) is beyond every mirrored null value, so its p-value is the smallest.
        Assert.Equal(features.Min(f => f.NullP), features[0].NullP);
    }
}
