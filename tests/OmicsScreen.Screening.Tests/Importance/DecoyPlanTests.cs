using OmicsScreen.Engine.Binning;
using OmicsScreen.Screening.Importance;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Importance;

public sealed class DecoyPlanTests
{
    [Fact]
    public void The_decoys_raw_values_are_permuted_as_their_codes_are_in_the_forests()
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 60, FeatureCount = 80 });
        var plan = DecoyPlan.For(panel.FeatureCount, 30, runSeed: 7);
        var binned = new BinMapper().Bin(panel.Matrix);
        var augmented = CorrectedImpurityImportance.Augment(binned, plan.Sources, runSeed: 7, repeat: 3);
        var values = plan.Values(panel.Matrix);
        // Binning the permuted raw values with the source's bins gives the decoy's codes.
        for (int d = 0; d < plan.DecoyCount; d++)
        {
            var codes = augmented.Codes(2 * panel.FeatureCount + d);
            var bins = binned.Bins(plan.Sources[d]);
            for (int s = 0; s < panel.SampleCount; s++)
                Assert.Equal(codes[s], bins.CodeOf(values.Value(d, s), values.State(d, s)));
        }
    }

    [Fact]
    public void Every_repeat_grows_the_same_decoys()
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 40, FeatureCount = 70 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var plan = DecoyPlan.For(panel.FeatureCount, 20, runSeed: 3);
        var first = CorrectedImpurityImportance.Augment(binned, plan.Sources, 3, repeat: 0);
        var second = CorrectedImpurityImportance.Augment(binned, plan.Sources, 3, repeat: 5);
        for (int d = 0; d < 20; d++)
            Assert.Equal(first.Codes(140 + d).ToArray(), second.Codes(140 + d).ToArray());
        // The permuted copies that correct the impurity bias are drawn afresh for each repeat.
        Assert.NotEqual(first.Codes(70).ToArray(), second.Codes(70).ToArray());
        Assert.Equal(plan.Sources, DecoyPlan.For(panel.FeatureCount, 20, runSeed: 3).Sources);
    }
}
