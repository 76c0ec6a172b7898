using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Locking;

public class LockedPanelEvaluationTests
{
    [Fact]
    public void Calibration_groups_samples_by_predicted_probability_and_reports_the_observed_rate()
    {
        // 20 samples give 2 groups of 10 (at least 10 per group). Hand count on the sorted scores:
        // low group 0.00..0.45 (mean 0.225), positives at 0.20 and 0.40 -> 0.2;
        // high group 0.50..0.95 (mean 0.725), positives at 0.5, 0.6, 0.7, 0.8, 0.85, 0.9, 0.95 -> 0.7.
        var predicted = new double[20];
        var positive = new bool[20];
        for (int i = 0; i < 20; i++) predicted[i] = (19 - i) * 0.05;
        foreach (double p in new[] { 0.20, 0.40, 0.50, 0.60, 0.70, 0.80, 0.85, 0.90, 0.95 })
            positive[Array.FindIndex(predicted, v => Math.Abs(v - p) < 1e-9)] = true;
        var bins = LockedPanelEvaluation.Calibrate(predicted, positive);
        Assert.Equal(2, bins.Count);
        Assert.Equal(10, bins[0].SampleCount);
        Assert.Equal(0.0, bins[0].LowestPredicted, 12);
        Assert.Equal(0.45, bins[0].HighestPredicted, 12);
        Assert.Equal(0.225, bins[0].MeanPredicted, 12);
        Assert.Equal(0.2, bins[0].ObservedPositiveRate, 12);
        Assert.Equal(0.725, bins[1].MeanPredicted, 12);
        Assert.Equal(0.7, bins[1].ObservedPositiveRate, 12);
    }

    [Fact]
    public void Large_cohorts_get_ten_groups_of_risk()
    {
        // Deciles of risk (Hosmer & Lemeshow 1980): 250 samples -> 10 groups of 25.
        var predicted = Enumerable.Range(0, 250).Select(i => i / 250.0).ToArray();
        var bins = LockedPanelEvaluation.Calibrate(predicted, new bool[250]);
        Assert.Equal(10, bins.Count);
        Assert.All(bins, b => Assert.Equal(25, b.SampleCount));
    }

    [Fact]
    public void Auc_interval_error_and_confusion_follow_the_locked_call()
    {
        // Hand-made scores of 6 samples, classes "ctrl" (0) and "case" (1, positive), threshold 0.5.
        double[] caseProbability = [0.9, 0.7, 0.4, 0.6, 0.2, 0.1];
        var probabilities = new double[12];
        var called = new int[6];
        for (int s = 0; s < 6; s++)
        {
            probabilities[2 * s] = 1 - caseProbability[s];
            probabilities[2 * s + 1] = caseProbability[s];
            called[s] = caseProbability[s] >= 0.5 ? 1 : 0;
        }
        var scores = new LockedPanelScores(["a", "b", "c", "d", "e", "f"], ["ctrl", "case"], 1, 0.5, probabilities, called, []);
        // The truth lists its classes in the other order, to prove classes are matched by name.
        var truth = new ClassOutcome("status", ["case", "ctrl"], [0, 0, 0, 1, 1, 1]);
        var performance = LockedPanelEvaluation.Evaluate(scores, truth);

        // AUC and interval straight from the project's DeLong (DeLong et al. 1988) on the same scores.
        var reference = DeLong.EstimateByPairs([0.9, 0.7, 0.4], [0.6, 0.2, 0.1]);
        var interval = AucInterval.Compute(reference.Auc, reference.StandardError);
        Assert.Equal(8.0 / 9.0, performance.Auc!.Value, 12);
        Assert.Equal(reference.Auc, performance.Auc.Value, 12);
        Assert.Equal(interval.Lower, performance.AucInterval!.Value.Lower, 12);
        Assert.Equal(interval.Upper, performance.AucInterval.Value.Upper, 12);
        // Calls: cases 0.9, 0.7 right, 0.4 wrong; controls 0.6 wrong, 0.2, 0.1 right.
        Assert.Equal(2.0 / 6.0, performance.Error, 12);
        Assert.Equal([2, 1], performance.Confusion[0]);
        Assert.Equal([1, 2], performance.Confusion[1]);
    }

    [Fact]
    public void An_outcome_class_the_panel_does_not_know_is_refused_by_name()
    {
        var scores = new LockedPanelScores(["a", "b"], ["ctrl", "case"], 1, 0.5, [0.5, 0.5, 0.2, 0.8], [1, 1], []);
        var truth = new ClassOutcome("status", ["case", "relapse"], [0, 1]);
        var error = Assert.Throws<ArgumentException>(() => LockedPanelEvaluation.Evaluate(scores, truth));
        Assert.Contains("relapse", error.Message);
    }
}
