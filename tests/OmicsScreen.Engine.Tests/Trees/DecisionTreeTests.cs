using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Tests.Trees;

public class DecisionTreeTests
{
    /// <summary>
    /// Root splits feature 0 at bin 1 (value 2.5): missing left, below detection right. Its right
    /// child splits feature 1 at bin 0 (value 10.5). Leaves: node 1 class 0, node 3 class 1, node 4 class 0.
    /// </summary>
    internal static DecisionTree HandBuilt() => new(
        classCount: 2,
        features: [0, -1, 1, -1, -1],
        binThresholds: [1, 0, 0, 0, 0],
        thresholds: [2.5f, float.NaN, 10.5f, float.NaN, float.NaN],
        missingCodes: [3, 0, 2, 0, 0],
        routing: [UnmeasuredRouting.MissingLeft, 0, UnmeasuredRouting.BelowDetectionLeft, 0, 0],
        leftChildren: [1, -1, 3, -1, -1],
        rightChildren: [2, -1, 4, -1, -1],
        classWeights: [5, 5, 4, 0, 1, 5, 0, 4, 1, 1],
        nodeClasses: [0, 0, 1, 1, 0],
        impurityDecreases: [0.3, 0, 0.1, 0, 0],
        sampleCounts: [10, 4, 6, 4, 2]);

    [Fact]
    public void Codes_follow_thresholds_and_learned_sides_for_unmeasured_cells()
    {
        var tree = HandBuilt();
        Assert.True(tree.GoesLeft(0, 1));
        Assert.False(tree.GoesLeft(0, 2));
        Assert.True(tree.GoesLeft(0, 3));   // missing code of feature 0
        Assert.False(tree.GoesLeft(0, 4));  // below-detection code
        Assert.True(tree.GoesLeft(2, 3));   // below-detection code of feature 1 goes left there
        Assert.False(tree.GoesLeft(2, 2));  // missing code of feature 1 goes right
        Assert.Equal([0, 1], tree.SplitFeatures());
    }

    [Fact]
    public void Raw_values_and_states_reach_the_same_leaves_as_their_codes()
    {
        var builder = new FeatureMatrixBuilder(["a", "b"], ["s0", "s1", "s2", "s3"]);
        builder.SetMeasured(0, 0, 2f); builder.SetMeasured(1, 0, 99f);
        builder.SetMeasured(0, 1, 3f); builder.SetMeasured(1, 1, 10f);
        builder.SetMissing(0, 2); builder.SetMeasured(1, 2, 11f);
        builder.SetBelowDetection(0, 3, 0.5f); builder.SetBelowDetection(1, 3, 1f);
        var raw = builder.Build();
        var tree = HandBuilt();
        Assert.Equal(1, tree.LeafOf(raw, 0));
        Assert.Equal(3, tree.LeafOf(raw, 1));
        Assert.Equal(1, tree.LeafOf(raw, 2));
        Assert.Equal(3, tree.LeafOf(raw, 3));
    }

    [Fact]
    public void Replacing_a_code_reroutes_only_through_that_feature()
    {
        var panel = TestSupport.SyntheticPanel.Generate(new TestSupport.SyntheticPanelSpec { SampleCount = 30, FeatureCount = 2 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var forest = Engine.Forests.ForestTrainer.Train(binned, panel.Outcome, new Engine.Forests.ForestOptions { TreeCount = 3 });
        var tree = forest.Tree(0);
        for (int s = 0; s < 30; s++)
        {
            Assert.Equal(tree.LeafOf(binned, s), tree.LeafOf(binned, s, 1, binned.Codes(1)[s]));
            for (byte code = 0; code < binned.Bins(0).CodeCount; code++)
            {
                int expected = LeafWithCode(tree, binned, s, 0, code);
                Assert.Equal(expected, tree.LeafOf(binned, s, 0, code));
            }
        }
    }

    private static int LeafWithCode(DecisionTree tree, BinnedMatrix binned, int sample, int feature, byte code)
    {
        int node = 0;
        while (!tree.IsLeaf(node))
        {
            byte c = tree.Features[node] == feature ? code : binned.Codes(tree.Features[node])[sample];
            node = tree.GoesLeft(node, c) ? tree.LeftChildren[node] : tree.RightChildren[node];
        }
        return node;
    }

    [Fact]
    public void Impurity_decreases_add_up_per_feature()
    {
        var totals = new double[2];
        HandBuilt().AddImpurityDecreases(totals);
        Assert.Equal([0.3, 0.1], totals);
    }
}
