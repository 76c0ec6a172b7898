using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Screen;

public sealed class EvidenceCombinationTests
{
    [Fact]
    public void A_test_at_p_near_one_cannot_cancel_strong_evidence_from_another()
    {
        // Uncapped, tan((0.5 - p) pi) at p = 1 is about -1.6e16 and the Cauchy combination (Liu &
        // Xie 2020) of (1e-8, 1e-8, 1) with weights 0.4/0.4/0.2 would be near 1 (computed here as
        // the uncapped reference). Capped at 0.9, the two strong tests carry the combination:
        // T = 0.8 / (pi 1e-8) + 0.2 tan(-0.4 pi) gives p = atan(1/T)/pi, about 1.25e-8.
        double uncapped = CauchyCombination.Combine([1e-8, 1e-8, 1.0], [0.4, 0.4, 0.2]);
        Assert.True(uncapped > 0.4, $"uncapped {uncapped}");
        double capped = ScreenAggregation.Combine(1e-8, 1e-8, 1.0);
        Assert.Equal(1.25e-8, capped, 1e-10);
    }

    [Fact]
    public void Tests_that_did_not_run_are_left_out_and_weights_renormalise()
    {
        // Weights renormalised over the tests present (Liu & Xie 2020 allow any weights summing to 1):
        // forest and rank test alone weigh 0.5 each, the plain two-test combination.
        Assert.Equal(CauchyCombination.Combine(0.01, 0.2), ScreenAggregation.Combine(0.01, 0.2, double.NaN), 1e-15);
        // A p-value above the cap enters as the cap.
        Assert.Equal(ScreenAggregation.Combine(0.01, 0.9, double.NaN), ScreenAggregation.Combine(0.01, 0.999, double.NaN), 1e-15);
        Assert.Equal(CauchyCombination.Combine(0.01, 0.9), ScreenAggregation.Combine(0.01, 1.0, double.NaN), 1e-15);
    }

    [Fact]
    public void Follow_up_screens_weigh_the_rank_test_four_times_the_forest()
    {
        // Liu & Xie (2020), weights 0.2 (forest p 0.3) and 0.8 (rank p 1e-4):
        // T = 0.2 tan(0.2 pi) + 0.8 tan((0.5 - 1e-4) pi), p = atan(1/T)/pi = 1.249928652798981e-4
        // (computed with Python's math module). At even weights the same pair gives about 2e-4.
        var weights = new CombinationWeights(0.2, 0.8, 0);
        Assert.Equal(1.249928652798981e-4, ScreenAggregation.Combine(0.3, 1e-4, double.NaN, weights), 1e-15);
        Assert.True(ScreenAggregation.Combine(0.3, 1e-4, double.NaN) > 1.9e-4);
    }

    [Fact]
    public void A_follow_up_screen_combines_features_with_its_kind_s_weights()
    {
        // The weights reach the screen: every feature's combined p-value is the follow-up weights'
        // combination of its forest and rank-test p-values (the decoys go through the same call).
        var (matrix, _, generator) = TestSupport.StandardNormalFeatures.Draw(60, 20, 5, s => $"S{s:D3}");
        var times = new double[60];
        var events = new bool[60];
        for (int s = 0; s < 60; s++)
        {
            times[s] = -Math.Log(1 - generator.NextDouble());
            events[s] = s % 3 != 0;
        }
        var panel = new Engine.Panels.Panel(matrix, new Engine.Panels.FollowUpOutcome("months", "relapse", times, events));
        var result = ScreenRunner.Run(panel, new ScreenOptions { Seed = 2, HalfSamplePairs = 2, TreesPerForest = 30, CurveFolds = 0, DecoyCount = 100 });
        var weights = new CombinationWeights(0.2, 0.8, 0);
        Assert.All(result.Features, f => Assert.Equal(ScreenAggregation.Combine(f.ForestP, f.RankTestP, double.NaN, weights), f.CombinedP, 1e-15));
    }
}
