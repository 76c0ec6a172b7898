using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Trees;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Forests;

public class ImpurityImportanceTests
{
    [Fact]
    public void Mean_and_normalised_decreases_of_hand_built_trees()
    {
        var first = Trees.DecisionTreeTests.HandBuilt(); // decreases: feature 0 = 0.3, feature 1 = 0.1
        var leaf = new DecisionTree(2, [-1], [0], [float.NaN], [0], [0], [-1], [-1], [3, 1], [0], [0], [4]);
        var forest = new Forest(ForestOptions.Default, 0, [first, leaf],
            [new TreeOutOfBag([], []), new TreeOutOfBag([], [])], sampleCount: 10, featureCount: 3, classCount: 2);
        var importance = ImpurityImportance.From(forest);
        // Mean over both trees, the single-leaf tree counting zero: (0.3 + 0) / 2, (0.1 + 0) / 2.
        Assert.Equal([0.15, 0.05, 0.0], importance.MeanDecrease.ToArray());
        // scikit-learn's feature_importances_: per-tree shares 0.75 / 0.25, leaf-only trees skipped.
        Assert.Equal(0.75, importance.NormalisedMeanDecrease[0], 15);
        Assert.Equal(0.25, importance.NormalisedMeanDecrease[1], 15);
    }

    [Fact]
    public void A_tree_grown_to_purity_spends_exactly_its_root_Gini_index()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 200, FeatureCount = 15, ClassCount = 3, Seed = 3 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var forest = ForestTrainer.Train(binned, panel.Outcome, new ForestOptions { TreeCount = 20 });
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var tree = forest.Tree(t);
            var totals = new double[binned.FeatureCount];
            tree.AddImpurityDecreases(totals);
            // The weighted decreases telescope: sum over splits = G_root - sum_leaves (W_leaf/W_root) G_leaf,
            // which is G_root when every leaf is pure (Breiman et al. 1984, ch. 4).
            double rootGini = GiniImpurity.Index(tree.ClassWeights[..3]);
            Assert.Equal(rootGini, totals.Sum(), 10);
        }
    }
}
