using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Metrics;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Forests;

public class OutOfBagVotesTests
{
    [Fact]
    public void Votes_curve_probabilities_and_AUC_agree_with_a_recount()
    {
        var (matrix, outcome) = WdbcData.Load();
        var binned = new BinMapper().Bin(matrix);
        var forest = ForestTrainer.Train(binned, outcome, new ForestOptions { TreeCount = 60, Seed = 12 });
        var votes = new OutOfBagVotes(forest, outcome);

        // Recount from scratch, tree by tree: each tree votes only for its out-of-bag rows.
        var recount = new int[matrix.SampleCount * 2];
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var tree = forest.Tree(t);
            foreach (int row in forest.OutOfBag(t).Rows) recount[row * 2 + tree.PredictClass(binned, row)]++;
        }
        Assert.Equal(recount, votes.Votes.ToArray());

        var tieBreaker = new VoteTieBreaker(forest.Options.Seed, forest.Options.Repeat, matrix.SampleCount, 2);
        int wrong = 0, voted = 0;
        var scores = new double[matrix.SampleCount];
        var positive = new bool[matrix.SampleCount];
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            int winner = tieBreaker.Winner(s, recount.AsSpan(s * 2, 2));
            Assert.Equal(winner, votes.PredictedClasses[s]);
            scores[s] = votes.Probability(s, 1);
            positive[s] = outcome.SampleClasses[s] == 1;
            if (winner < 0) continue;
            voted++;
            if (winner != outcome.SampleClasses[s]) wrong++;
        }
        Assert.Equal((double)wrong / voted, votes.Error, 15);
        Assert.Equal(votes.Error, votes.ErrorCurve[^1]);
        Assert.Equal(MannWhitneyAuc.Compute(scores, positive), votes.Auc!.Value, 15);
        // WDBC is nearly separable: the reference forest's OOB accuracy is 0.9625 (rf_summary.json),
        // so an OOB AUC far above 0.9 is expected (common practice).
        Assert.True(votes.Auc > 0.97);
        // The curve falls as trees are added: the first tree's error exceeds the final one.
        Assert.True(votes.ErrorCurve[0] > votes.ErrorCurve[^1]);
    }

    [Fact]
    public void Tied_votes_do_not_favour_the_first_class()
    {
        var tieBreaker = new VoteTieBreaker(seed: 1, repeat: 0, sampleCount: 2000, classCount: 2);
        int first = 0;
        for (int s = 0; s < 2000; s++) if (tieBreaker.Winner(s, [3, 3]) == 0) first++;
        // A fair coin over 2000 ties: 1000 ± 3.3 SD (SD = sqrt(2000/4) = 22.4).
        Assert.InRange(first, 925, 1075);
        Assert.Equal(1, tieBreaker.Winner(0, [2, 5]));
        Assert.Equal(-1, tieBreaker.Winner(0, [0, 0]));
    }
}
