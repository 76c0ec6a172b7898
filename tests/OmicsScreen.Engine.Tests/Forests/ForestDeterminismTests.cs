using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Forests;

public class ForestDeterminismTests
{
    private static (BinnedMatrix, Engine.Panels.ClassOutcome) Data()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 150, FeatureCount = 60, MissingFraction = 0.05, Seed = 4 });
        return (new BinMapper().Bin(panel.Matrix), panel.Outcome);
    }

    [Fact]
    public void One_two_and_four_threads_grow_identical_forests()
    {
        var (binned, outcome) = Data();
        var options = new ForestOptions { TreeCount = 40, Seed = 99 };
        var one = ForestTrainer.Train(binned, outcome, options with { ThreadCount = 1 });
        var two = ForestTrainer.Train(binned, outcome, options with { ThreadCount = 2 });
        var four = ForestTrainer.Train(binned, outcome, options with { ThreadCount = 4 });
        ForestAssert.Identical(one, two);
        ForestAssert.Identical(one, four);
        Assert.Equal(new OutOfBagVotes(one, outcome).Votes.ToArray(), new OutOfBagVotes(four, outcome).Votes.ToArray());
    }

    [Fact]
    public void Trees_grown_in_two_batches_combine_into_the_same_forest()
    {
        var (binned, outcome) = Data();
        var options = new ForestOptions { TreeCount = 30, Seed = 5, Repeat = 2 };
        var whole = ForestTrainer.Train(binned, outcome, options);
        var later = ForestTrainer.Train(binned, outcome, options, firstTree: 12, treeCount: 18);
        var first = ForestTrainer.Train(binned, outcome, options with { ThreadCount = 1 }, firstTree: 0, treeCount: 12);
        var combined = Forest.Combine([later, first]);
        ForestAssert.Identical(whole, combined);
        var wholeVotes = new OutOfBagVotes(whole, outcome);
        var combinedVotes = new OutOfBagVotes(combined, outcome);
        Assert.Equal(wholeVotes.Votes.ToArray(), combinedVotes.Votes.ToArray());
        Assert.Equal(wholeVotes.ErrorCurve.ToArray(), combinedVotes.ErrorCurve.ToArray());
    }

    [Fact]
    public void A_different_seed_or_repeat_grows_a_different_forest()
    {
        var (binned, outcome) = Data();
        var options = new ForestOptions { TreeCount = 5, Seed = 5 };
        var baseline = ForestTrainer.Train(binned, outcome, options).Tree(0).Features.ToArray();
        Assert.NotEqual(baseline, ForestTrainer.Train(binned, outcome, options with { Seed = 6 }).Tree(0).Features.ToArray());
        Assert.NotEqual(baseline, ForestTrainer.Train(binned, outcome, options with { Repeat = 1 }).Tree(0).Features.ToArray());
    }
}
