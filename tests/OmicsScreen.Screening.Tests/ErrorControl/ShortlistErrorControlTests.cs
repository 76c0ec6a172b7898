using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;
using Xunit.Abstractions;

namespace OmicsScreen.Screening.Tests.ErrorControl;

/// <summary>
/// The shortlist's promise on panels of known truth: nothing on null panels (a false discovery
/// rate of 0.10 allows a non-empty list in at most about 10% of them), the planted markers found
/// with a false discovery proportion near the level, and a locked panel made only of listed markers.
/// </summary>
public sealed class ShortlistErrorControlTests(ITestOutputHelper output)
{
    private static ScreenOptions Small(ulong seed) => new()
    {
        Seed = seed,
        HalfSamplePairs = 5,
        TreesPerForest = 100,
        CurveFolds = 0,
    };

    public static TheoryData<string> NullShapes => ["independent", "correlated blocks", "imbalanced 1:3"];

    private static CausalBlockPanel.Design NullDesign(string shape, ulong seed) => shape switch
    {
        "independent" => new CausalBlockPanel.Design { Null = true, SampleCount = 80, FeatureCount = 300, BlockCorrelation = 0, Seed = 700 + seed },
        "correlated blocks" => new CausalBlockPanel.Design { Null = true, SampleCount = 80, FeatureCount = 300, BlockCorrelation = 0.6, Seed = 800 + seed },
        _ => new CausalBlockPanel.Design { Null = true, SampleCount = 80, FeatureCount = 300, CaseFraction = 0.25, Seed = 900 + seed },
    };

    [Theory]
    [MemberData(nameof(NullShapes))]
    public void Null_panels_give_an_empty_shortlist_in_at_least_9_of_10_seeds(string shape)
    {
        int nonEmpty = 0;
        for (ulong seed = 1; seed <= 10; seed++)
        {
            var (panel, _) = CausalBlockPanel.Generate(NullDesign(shape, seed));
            var result = ScreenRunner.Run(panel, Small(seed));
            output.WriteLine($"{shape} seed {seed}: {result.Shortlist.Count} listed, smallest q {result.Features.Min(f => f.QValue):0.000}");
            if (result.Shortlist.Count > 0) nonEmpty++;
            // An empty list locks nothing.
            if (result.Shortlist.Count == 0) Assert.Equal(0, result.LockedPanelSize);
        }
        // Under the global null a false discovery rate of 0.10 is the chance of any list at all
        // (Benjamini & Hochberg 1995), so 9 of 10 empty is the promise at its level.
        Assert.True(nonEmpty <= 1, $"{nonEmpty} of 10 null panels gave a non-empty shortlist");
    }

    [Fact]
    public void The_locked_panel_is_a_prefix_of_the_shortlist_and_carries_the_estimate_of_that_procedure()
    {
        var (panel, causal) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 120, FeatureCount = 400, Seed = 31 });
        var result = ScreenRunner.Run(panel, Small(31) with { CurveFolds = 3, CurveInnerPairs = 3, CurveMaxPanelSize = 21 });
        var curve = Assert.IsType<PanelSizeCurve>(result.PanelSize);
        Assert.InRange(result.LockedPanelSize, 1, result.Shortlist.Count);
        Assert.Equal(curve.LockedSize, result.LockedPanelSize);
        Assert.Equal(curve.LockedEstimate, result.LockedPanelEstimate);
        Assert.InRange(result.LockedPanelEstimate, 0.6, 1.0);
        // The curve is evaluated at the locked size itself.
        Assert.Contains(curve.Points, p => p.PanelSize == result.LockedPanelSize);
        // The cross-validated ROC data of the locked procedure: every held-out sample once per fold repeat.
        Assert.Equal(panel.SampleCount, curve.LockedOutOfFoldScores.Count);
        Assert.Equal(panel.SampleCount, curve.LockedOutOfFoldPositive.Count);
        var locked = PanelLocker.Lock(panel, result, new PanelLockOptions { Seed = 31, TreeCount = 50 });
        var expected = result.Shortlist.Take(result.LockedPanelSize).Select(e => e.Forest.Feature).ToArray();
        Assert.Equal(expected, locked.MarkerNames);
        output.WriteLine($"listed {result.Shortlist.Count} ({result.Shortlist.Count(e => causal[e.Forest.FeatureIndex])} causal), locked {result.LockedPanelSize}, estimate {result.LockedPanelEstimate:0.000}, curve favours {curve.RecommendedSize}");
    }

    [Fact]
    public void Planted_markers_are_found_with_a_false_discovery_proportion_near_the_level()
    {
        // Three seeds of 100 x 1,000 with 30 causal features in 6 correlated blocks (effects 0.6-1.2
        // SD; design in CausalBlockPanel). A noise feature in a causal block is correlated with the
        // causal ones, so it differs between classes too; it is counted as false here, which makes
        // the proportion an upper figure for the marginal false discovery rate the rule controls.
        double recovered = 0, falseShare = 0, estimate = 0;
        for (ulong seed = 1; seed <= 3; seed++)
        {
            var (panel, causal) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { FeatureCount = 1000, Seed = 40 + seed });
            var result = ScreenRunner.Run(panel, Small(seed) with { HalfSamplePairs = 10, TreesPerForest = 300 });
            var listed = result.Shortlist.Select(e => e.Forest.FeatureIndex).ToList();
            // The univariate baseline: Mann-Whitney with Benjamini-Hochberg at 0.10 (common practice).
            int baseline = Enumerable.Range(0, panel.FeatureCount).Count(f => causal[f] && result.Univariate.Row(f, 0).QValue <= 0.10);
            int found = listed.Count(f => causal[f]);
            recovered += baseline == 0 ? 1 : Math.Min(1, (double)found / baseline);
            falseShare += listed.Count == 0 ? 0 : (double)listed.Count(f => !causal[f]) / listed.Count;
            estimate += result.Decoys.EstimatedFalseDiscoveryRate;
            output.WriteLine($"seed {seed}: listed {listed.Count}, causal {found} (baseline {baseline}), decoy estimate {result.Decoys.EstimatedFalseDiscoveryRate:0.000}");
        }
        recovered /= 3;
        falseShare /= 3;
        estimate /= 3;
        Assert.True(recovered >= 0.8, $"found {recovered:P0} of what the univariate baseline finds");
        // Level 0.10 plus a slack of 0.10 for three seeds and the correlated noise counted as false.
        Assert.True(falseShare <= 0.20, $"false discovery proportion {falseShare:0.000}");
        Assert.InRange(estimate, 0, 0.25);
    }
}
