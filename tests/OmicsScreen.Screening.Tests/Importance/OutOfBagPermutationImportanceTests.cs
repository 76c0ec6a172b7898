using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Importance;

namespace OmicsScreen.Screening.Tests.Importance;

public class OutOfBagPermutationImportanceTests
{
    [Fact]
    public void Permuting_only_split_features_equals_permuting_every_feature_exactly()
    {
        var (matrix, outcome) = ImportanceTestPanels.Binned(120, 40, 4, 1.0, seed: 3);
        var forest = ForestTrainer.Train(matrix, outcome, new ForestOptions { TreeCount = 60, Seed = 7, ThreadCount = 2 });

        var fast = OutOfBagPermutationImportance.Measure(forest, matrix, outcome, threadCount: 2);
        var naive = OutOfBagPermutationImportance.MeasureNaive(forest, matrix, outcome);

        Assert.Equal(naive.MeanAccuracyDrop, fast.MeanAccuracyDrop);
        Assert.Equal(naive.StandardError, fast.StandardError);
        Assert.Equal(naive.MeanBrierIncrease, fast.MeanBrierIncrease);
        // The comparison must not be vacuous: some feature matters.
        Assert.Contains(fast.MeanAccuracyDrop, drop => drop > 0.01);
    }

    [Fact]
    public void Re_walking_only_the_rows_that_meet_the_feature_equals_re_walking_every_out_of_bag_row()
    {
        // Deep trees on a panel with missing-free noise and a few signals: many split features per tree.
        var (matrix, outcome) = ImportanceTestPanels.Binned(300, 30, 4, 0.8, seed: 6);
        var forest = ForestTrainer.Train(matrix, outcome, new ForestOptions { TreeCount = 25, Seed = 5, ThreadCount = 2 });
        var scorer = new OutOfBagTreeScorer(matrix, outcome.SampleClasses.ToArray());
        int compared = 0, changed = 0;
        for (int t = 0; t < forest.TreeCount; t++)
        {
            scorer.Begin(forest.Tree(t), forest.OutOfBag(t));
            ulong treeSeed = OutOfBagTreeScorer.TreeSeed(forest, t);
            for (int f = 0; f < matrix.FeatureCount; f++)
            {
                var a = OutOfBagTreeScorer.FeatureGenerator(treeSeed, f);
                var b = OutOfBagTreeScorer.FeatureGenerator(treeSeed, f);
                var fast = scorer.ScoreFeature(f, ref a);
                var reference = scorer.ScoreFeatureByFullWalk(f, ref b);
                Assert.Equal(reference.AccuracyDrop, fast.AccuracyDrop);
                Assert.Equal(reference.BrierIncrease, fast.BrierIncrease, 12);
                compared++;
                if (reference.AccuracyDrop != 0) changed++;
            }
        }
        Assert.Equal(25 * 30, compared);
        Assert.True(changed > 50, $"only {changed} tree-feature pairs changed accuracy; the comparison would be weak");
    }

    [Fact]
    public void A_caller_drawn_permutation_scores_as_the_same_permutation_drawn_by_the_scorer()
    {
        // The covariate-tracking analysis hands the scorer its own (within-strata) permutations;
        // handed the very permutation ScoreFeature draws, the Brier increase must be the same
        // (the Brier score of Brier 1950, the permutation of Breiman 2001).
        var (matrix, outcome) = ImportanceTestPanels.Binned(300, 30, 4, 0.8, seed: 6);
        var forest = ForestTrainer.Train(matrix, outcome, new ForestOptions { TreeCount = 20, Seed = 5, ThreadCount = 2 });
        var scorer = new OutOfBagTreeScorer(matrix, outcome.SampleClasses.ToArray());
        int nonzero = 0;
        for (int t = 0; t < forest.TreeCount; t++)
        {
            scorer.Begin(forest.Tree(t), forest.OutOfBag(t));
            ulong treeSeed = OutOfBagTreeScorer.TreeSeed(forest, t);
            for (int f = 0; f < matrix.FeatureCount; f++)
            {
                var drawn = OutOfBagTreeScorer.FeatureGenerator(treeSeed, f);
                var copy = OutOfBagTreeScorer.FeatureGenerator(treeSeed, f);
                var donors = Enumerable.Range(0, scorer.RowCount).ToArray();
                copy.Shuffle(donors.AsSpan());
                double expected = scorer.ScoreFeature(f, ref drawn).BrierIncrease;
                Assert.Equal(expected, scorer.BrierIncreaseWithDonors(f, donors), 12);
                if (expected != 0) nonzero++;
            }
        }
        Assert.True(nonzero > 50, $"only {nonzero} tree-feature pairs changed the Brier score; the comparison would be weak");
    }

    [Fact]
    public void Results_are_identical_with_one_and_two_threads()
    {
        var (matrix, outcome) = ImportanceTestPanels.Binned(120, 40, 4, 1.0, seed: 4);
        var forest = ForestTrainer.Train(matrix, outcome, new ForestOptions { TreeCount = 60, Seed = 2, ThreadCount = 2 });
        var one = OutOfBagPermutationImportance.Measure(forest, matrix, outcome, threadCount: 1);
        var two = OutOfBagPermutationImportance.Measure(forest, matrix, outcome, threadCount: 2);
        Assert.Equal(one.MeanAccuracyDrop, two.MeanAccuracyDrop);
        Assert.Equal(one.StandardError, two.StandardError);
        Assert.Equal(one.MeanBrierIncrease, two.MeanBrierIncrease);

        int[][] groups = [[0, 1], [2], [10, 11, 12]];
        Assert.Equal(OutOfBagPermutationImportance.MeasureGroups(forest, matrix, outcome, groups, threadCount: 1),
            OutOfBagPermutationImportance.MeasureGroups(forest, matrix, outcome, groups, threadCount: 2));
    }

    [Fact]
    public void Informative_features_lose_accuracy_and_gain_Brier_score_when_permuted_and_noise_does_not()
    {
        var (matrix, outcome) = ImportanceTestPanels.Binned(200, 30, 3, 1.5, seed: 5);
        var forest = ForestTrainer.Train(matrix, outcome, new ForestOptions { TreeCount = 200, Seed = 1 });
        var importance = OutOfBagPermutationImportance.Measure(forest, matrix, outcome);
        double noiseMean = 0;
        for (int f = 3; f < 30; f++) noiseMean += importance.MeanAccuracyDrop[f] / 27;
        // Breiman 2001: permuting a feature the outcome depends on raises OOB error; noise leaves it unchanged on average.
        for (int f = 0; f < 3; f++)
        {
            Assert.True(importance.MeanAccuracyDrop[f] > noiseMean + 4 * importance.StandardError[f],
                $"feature {f}: drop {importance.MeanAccuracyDrop[f]:F4}, SE {importance.StandardError[f]:F4}, noise mean {noiseMean:F4}");
            Assert.True(importance.MeanBrierIncrease[f] > 0.01, $"feature {f}: Brier increase {importance.MeanBrierIncrease[f]:F4}");
        }
        Assert.InRange(noiseMean, -0.01, 0.01);
    }
}
