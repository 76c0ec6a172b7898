using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.TestSupport;
using Xunit.Abstractions;

namespace OmicsScreen.Engine.Tests.Forests;

public class HeldOutErrorTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(300, 1UL)]
    [InlineData(40, 2UL)]
    public void Out_of_bag_error_agrees_with_the_error_on_a_held_out_part(int featureCount, ulong seed)
    {
        // Breiman (1996, "Out-of-bag estimation"; 2001): the out-of-bag error estimates the error
        // on new samples from the same distribution. A forest grown on 650 samples (binned on them
        // alone) scores the other 1,950 of the same simulated design.
        var panel = ForestReferenceShapes.Generate(2_600, featureCount);
        var classes = panel.Outcome.SampleClasses;
        // Classes come in two blocks of 1,300 (SyntheticPanel), so every fourth row is a stratified quarter.
        var train = Enumerable.Range(0, 2_600).Where(s => s % 4 == 0).ToArray();
        var test = Enumerable.Range(0, 2_600).Where(s => s % 4 != 0).ToArray();
        var trainOutcome = panel.Outcome.SelectSamples(train);
        var binned = new BinMapper().Bin(panel.Matrix.SelectSamples(train));
        var forest = ForestTrainer.Train(binned, trainOutcome, new ForestOptions { TreeCount = 500, Seed = seed });
        double outOfBag = new OutOfBagVotes(forest, trainOutcome).Error;

        var predicted = forest.Predict(binned.Encode(panel.Matrix.SelectSamples(test))).PredictedClasses;
        int wrong = 0;
        for (int i = 0; i < test.Length; i++) if (predicted[i] != classes[test[i]]) wrong++;
        double heldOut = (double)wrong / test.Length;

        // Both are proportions of misclassified samples; their difference has binomial standard
        // error sqrt(e(1-e)(1/650 + 1/1950)) (common practice), and three of those bound it.
        double e = (outOfBag + heldOut) / 2;
        double tolerance = 3 * Math.Sqrt(e * (1 - e) * (1.0 / train.Length + 1.0 / test.Length));
        output.WriteLine($"out-of-bag {outOfBag:F4}, held out {heldOut:F4}, tolerance {tolerance:F4}");
        Assert.InRange(heldOut - outOfBag, -tolerance, tolerance);
    }
}
