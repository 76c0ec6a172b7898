using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Forests;

public class SampleWeightTests
{
    [Fact]
    public void Scaling_every_weight_by_a_constant_grows_the_same_trees()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 120, FeatureCount = 12, Seed = 31 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var options = new ForestOptions { TreeCount = 20, Seed = 8 };
        var plain = ForestTrainer.Train(binned, panel.Outcome, options);
        var doubled = ForestTrainer.Train(binned, panel.Outcome, options, sampleWeights: Enumerable.Repeat(2.0, 120).ToArray());
        for (int t = 0; t < plain.TreeCount; t++)
        {
            // The Gini index depends on class proportions only (Breiman et al. 1984), so a common
            // factor changes no split; node class weights double.
            Assert.Equal(plain.Tree(t).Features.ToArray(), doubled.Tree(t).Features.ToArray());
            Assert.Equal(plain.Tree(t).BinThresholds.ToArray(), doubled.Tree(t).BinThresholds.ToArray());
            Assert.Equal(plain.Tree(t).ClassWeights.ToArray().Select(w => 2 * w), doubled.Tree(t).ClassWeights.ToArray());
            Assert.Equal(plain.OutOfBag(t).PredictedClasses.ToArray(), doubled.OutOfBag(t).PredictedClasses.ToArray());
        }
    }

    [Fact]
    public void Zero_weight_samples_do_not_shape_any_tree()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 100, FeatureCount = 8, Seed = 32 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var weights = Enumerable.Range(0, 100).Select(s => s < 20 ? 0.0 : 1.0).ToArray();
        var forest = ForestTrainer.Train(binned, panel.Outcome, new ForestOptions { TreeCount = 20 }, sampleWeights: weights);
        for (int t = 0; t < forest.TreeCount; t++)
        {
            // The root holds every drawn sample of positive weight: the weighted ones not out of bag.
            int weightedOutOfBag = forest.OutOfBag(t).Rows.ToArray().Count(s => s >= 20);
            Assert.Equal(80 - weightedOutOfBag, forest.Tree(t).NodeSampleCounts[0]);
        }
    }

    [Fact]
    public void Negative_or_missing_weights_are_refused()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 10, FeatureCount = 3 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var weights = Enumerable.Repeat(1.0, 10).ToArray();
        weights[3] = -1;
        Assert.Throws<ArgumentException>(() => ForestTrainer.Train(binned, panel.Outcome, new ForestOptions { TreeCount = 2 }, sampleWeights: weights));
        weights[3] = double.NaN;
        Assert.Throws<ArgumentException>(() => ForestTrainer.Train(binned, panel.Outcome, new ForestOptions { TreeCount = 2 }, sampleWeights: weights));
    }
}
