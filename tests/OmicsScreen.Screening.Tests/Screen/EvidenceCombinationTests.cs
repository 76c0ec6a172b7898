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
}
