using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Locking;

public class PanelLockerTests
{
    [Fact]
    public void The_threshold_is_the_youden_threshold_of_the_out_of_bag_probabilities()
    {
        var train = WdbcLockedPanels.Train;
        var locked = WdbcLockedPanels.Panel;
        // The same forest again, grown by the engine directly (same seed, same options).
        var matrix = train.Matrix.SelectFeatures(WdbcLockedPanels.MarkerIndices(train.Matrix));
        var forest = ForestTrainer.Train(new BinMapper().Bin(matrix), train.Outcome, WdbcLockedPanels.ForestOptions);
        var outOfBag = new OutOfBagVotes(forest, train.Outcome);
        var scores = new double[train.SampleCount];
        var positive = new bool[train.SampleCount];
        for (int s = 0; s < scores.Length; s++)
        {
            scores[s] = outOfBag.Probability(s, train.Outcome.PositiveClass);
            positive[s] = train.Outcome.SampleClasses[s] == train.Outcome.PositiveClass;
        }
        Assert.Equal(YoudenThreshold.Choose(scores, positive), locked.Threshold);
        Assert.Equal(outOfBag.Auc, locked.OutOfBagAuc);
        Assert.Equal(WdbcLockedPanels.Markers, locked.MarkerNames);
        Assert.Equal("malignant", locked.ClassNames[locked.PositiveClass]);
        // WDBC is nearly separable on these markers; rf_summary.json gives an out-of-bag AUC near 0.99 with all 30.
        Assert.InRange(locked.OutOfBagAuc!.Value, 0.95, 1.0);
    }

    [Fact]
    public void Scores_from_raw_values_equal_the_engine_forest_vote_fractions()
    {
        var train = WdbcLockedPanels.Train;
        var matrix = train.Matrix.SelectFeatures(WdbcLockedPanels.MarkerIndices(train.Matrix));
        var forest = ForestTrainer.Train(new BinMapper().Bin(matrix), train.Outcome, WdbcLockedPanels.ForestOptions);
        var test = WdbcLockedPanels.Test;
        var expected = forest.Predict(test.Matrix.SelectFeatures(WdbcLockedPanels.MarkerIndices(test.Matrix)));
        var scores = LockedPanelScorer.Score(WdbcLockedPanels.Panel, test.Matrix);
        for (int s = 0; s < test.SampleCount; s++)
            for (int c = 0; c < 2; c++)
                Assert.Equal(expected.Probability(s, c), scores.Probability(s, c));
    }

    [Fact]
    public void Locking_from_a_screen_keeps_the_top_of_its_order()
    {
        var train = WdbcLockedPanels.Train;
        var result = ScreenRunner.Run(train, new ScreenOptions { Seed = 3, HalfSamplePairs = 2, TreesPerForest = 40, CurveFolds = 0 });
        var locked = PanelLocker.Lock(train, result, new PanelLockOptions { PanelSize = 4, Seed = 3, TreeCount = 60 });
        Assert.Equal(result.Order.Take(4).Select(f => train.Matrix.FeatureNames[f]), locked.MarkerNames);
        Assert.Equal(60, locked.Trees.Count);
        Assert.Equal(4, locked.Provenance.PanelSize);
        Assert.Equal(train.SampleCount, locked.Provenance.DiscoverySampleCount);
        // Without a size and without a curve, the shortlist length (at least one marker) decides.
        var bySize = PanelLocker.Lock(train, result, new PanelLockOptions { Seed = 3, TreeCount = 20 });
        Assert.Equal(Math.Max(1, result.Shortlist.Count), bySize.MarkerCount);
    }

    [Fact]
    public void Multi_class_panels_use_the_majority_vote_and_keep_no_threshold()
    {
        var (matrix, _) = OmicsScreen.TestSupport.WdbcData.Load();
        // Three classes cut from mean_radius terciles; the markers below carry that information.
        var radius = matrix.Column(0).ToArray();
        var sorted = radius.Order().ToArray();
        float low = sorted[sorted.Length / 3], high = sorted[2 * sorted.Length / 3];
        var classes = radius.Select(r => r < low ? 0 : r < high ? 1 : 2).ToArray();
        var panel = new Panel(matrix, new ClassOutcome("size", ["small", "medium", "large"], classes));
        var locked = PanelLocker.Lock(panel, [0, 2, 3], new ForestOptions { TreeCount = 30, Seed = 2 }, new PanelLockOptions());
        Assert.Null(locked.Threshold);
        Assert.Null(locked.OutOfBagAuc);
        var scores = LockedPanelScorer.Score(locked, matrix);
        int agree = 0;
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            var row = scores.Probabilities.AsSpan(3 * s, 3);
            Assert.Equal(row.IndexOf(Max(row)), scores.PredictedClasses[s]);
            if (scores.PredictedClasses[s] == classes[s]) agree++;
        }
        Assert.True(agree > 0.9 * matrix.SampleCount, $"{agree} of {matrix.SampleCount} called right on the training samples");
    }

    private static double Max(ReadOnlySpan<double> values)
    {
        double max = values[0];
        foreach (double v in values) max = Math.Max(max, v);
        return max;
    }
}
