using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Locking;

/// <summary>
/// Locked panels for a measured outcome (Friedman's first benchmark, reference/regression) and for
/// censored follow-up (the invented survival_forest.csv of reference/survival): locked on the first
/// rows, scored on the rest, whose outcome the forest never saw.
/// </summary>
public class OutcomeKindPanelLockerTests
{
    private static readonly PanelLockOptions Options = new() { Seed = 11, TreeCount = 120, ToolVersion = "test" };

    /// <summary>
    /// Friedman (1991): y = 10 sin(pi x1 x2) + 20 (x3 - 0.5)^2 + 10 x4 + 5 x5 + N(0, 1), so a forest on
    /// x1..x5 explains most of the variance of new samples (scikit-learn's forests reach a test R²
    /// near 0.8-0.9 on 200 training rows, from memory), and its out-of-bag R² is the same forest's as
    /// the engine computes it.
    /// </summary>
    [Fact]
    public void A_measured_panel_on_the_five_informative_features_predicts_new_samples()
    {
        var (train, test) = OutcomeKindLockedPanels.Friedman();
        int[] markers = [0, 1, 2, 3, 4];
        var locked = PanelLocker.LockMeasured(train, markers, OutcomeKindLockedPanels.ForestOptions(), Options);

        var binned = new Engine.Binning.BinMapper().Bin(train.Matrix.SelectFeatures(markers));
        var same = new RegressionOutOfBag(RegressionForestTrainer.Train(binned, train.Measured!.Values, OutcomeKindLockedPanels.ForestOptions()), train.Measured.Values);
        Assert.Equal(same.RSquared, locked.OutOfBagRSquared);
        Assert.Equal(same.RootMeanSquaredError, locked.OutOfBagRootMeanSquaredError);
        Assert.InRange(locked.OutOfBagRSquared, 0.6, 1.0);

        var scores = LockedPanelScorer.ScoreMeasured(locked, test.Matrix);
        var performance = LockedPanelEvaluation.EvaluateMeasured(scores, test.Measured!.Values);
        Assert.InRange(performance.RSquared, 0.6, 1.0);
        // Forest predictions shrink towards the training mean, so the calibration slope is at least near 1 (common practice).
        Assert.InRange(performance.Calibration.Slope, 0.8, 1.6);
        Assert.Empty(scores.Warnings);
        Assert.Equal("y", locked.OutcomeName);
        Assert.Equal(["x1", "x2", "x3", "x4", "x5"], locked.MarkerNames);
    }

    /// <summary>
    /// The invented follow-up of survival_forest.csv has hazard 0.1 exp(0.8 x1 - 0.6 x2 + 0.7 [x3 &gt; 0])
    /// (make_survival_forest_reference.R), so a survival forest on x1..x3 ranks new samples' risk
    /// well above chance (the true linear predictor's C is about 0.7 there; from the script's design),
    /// and the risk-group cut is the median of the discovery out-of-bag risk scores.
    /// </summary>
    [Fact]
    public void A_follow_up_panel_on_the_three_prognostic_markers_ranks_new_samples()
    {
        var (train, test) = OutcomeKindLockedPanels.Survival();
        int[] markers = [0, 1, 2];
        var locked = PanelLocker.LockFollowUp(train, markers, OutcomeKindLockedPanels.ForestOptions(), Options);

        var binned = new Engine.Binning.BinMapper().Bin(train.Matrix.SelectFeatures(markers));
        var forest = SurvivalForestTrainer.Train(binned, train.FollowUp!.FollowUp, OutcomeKindLockedPanels.ForestOptions());
        var outOfBag = forest.OutOfBagRisk().Where(r => !double.IsNaN(r)).Order().ToArray();
        double median = outOfBag.Length % 2 == 1 ? outOfBag[outOfBag.Length / 2] : 0.5 * (outOfBag[outOfBag.Length / 2 - 1] + outOfBag[outOfBag.Length / 2]);
        Assert.Equal(median, locked.RiskGroupCut, 1e-12);
        Assert.InRange(locked.OutOfBagConcordance, 0.6, 1.0);
        Assert.Equal(train.FollowUp.EventCount, locked.DiscoveryEventCount);

        // Scored from raw values, the discovery samples get the forest's in-bag ensemble mortality exactly.
        var discovery = LockedPanelScorer.ScoreFollowUp(locked, train.Matrix);
        Assert.Equal(forest.Risk(binned), discovery.RiskScores);

        var scores = LockedPanelScorer.ScoreFollowUp(locked, test.Matrix);
        var performance = LockedPanelEvaluation.EvaluateFollowUp(scores, test.FollowUp!.Times, test.FollowUp.Events, null);
        Assert.InRange(performance.Concordance.Concordance, 0.6, 1.0);
        Assert.Equal(scores.RiskScores.Count(r => r > locked.RiskGroupCut), scores.HighRiskCount);
    }

    /// <summary>
    /// The discovery risk groups the screen report draws: each discovery sample placed by the
    /// forest's out-of-bag risk against the cut (high above it, as apply places new samples), each
    /// group's Kaplan-Meier curve the engine's estimator (KaplanMeier, checked against R's survival
    /// package in SurvivalStatisticsTests) and the log-rank p the existing LogRankTest routine's.
    /// </summary>
    [Fact]
    public void The_discovery_risk_groups_are_the_out_of_bag_halves_with_their_Kaplan_Meier_curves_and_log_rank_test()
    {
        var (train, _) = OutcomeKindLockedPanels.Survival();
        int[] markers = [0, 1, 2];
        var (locked, groups) = PanelLocker.LockFollowUpWithRiskGroups(train, markers, OutcomeKindLockedPanels.ForestOptions(), Options);

        var binned = new Engine.Binning.BinMapper().Bin(train.Matrix.SelectFeatures(markers));
        var forest = SurvivalForestTrainer.Train(binned, train.FollowUp!.FollowUp, OutcomeKindLockedPanels.ForestOptions());
        var risk = forest.OutOfBagRisk();
        var kept = Enumerable.Range(0, risk.Length).Where(s => !double.IsNaN(risk[s])).ToArray();
        var time = kept.Select(s => train.FollowUp.Times[s]).ToArray();
        var events = kept.Select(s => train.FollowUp.Events[s]).ToArray();
        var high = kept.Select(s => risk[s] > locked.RiskGroupCut).ToArray();

        Assert.Equal(kept.Length, groups.SampleCount);
        Assert.Equal(high.Count(h => h), groups.HighRiskCount);
        // The median cut puts half the scored samples on each side (ties aside).
        Assert.InRange(groups.HighRiskCount, kept.Length / 2 - 1, kept.Length / 2 + 1);
        var expectedHigh = KaplanMeier.Estimate(time.Where((_, i) => high[i]).ToArray(), events.Where((_, i) => high[i]).ToArray());
        var expectedLow = KaplanMeier.Estimate(time.Where((_, i) => !high[i]).ToArray(), events.Where((_, i) => !high[i]).ToArray());
        Assert.Equal(expectedHigh.Time, groups.HighRisk!.Time);
        Assert.Equal(expectedHigh.Survival, groups.HighRisk.Survival);
        Assert.Equal(expectedLow.Time, groups.LowRisk!.Time);
        Assert.Equal(expectedLow.Survival, groups.LowRisk.Survival);
        var logRank = LogRankTest.TwoGroups(time, events, high);
        var drawn = groups.LogRank!.Value;
        Assert.Equal(logRank.PValue, drawn.PValue);
        Assert.Equal(logRank.ChiSquare, drawn.ChiSquare);
        // Harrell's C of the out-of-bag scores is the panel's out-of-bag concordance.
        Assert.Equal(locked.OutOfBagConcordance, groups.Concordance.Concordance, 12);
        // The prognostic markers separate the halves (hazard ratio about e^1.2 between them by design).
        Assert.True(drawn.PValue < 0.01, $"log-rank p {drawn.PValue}");
        // Locking with the groups locks the same panel.
        Assert.Equal(locked.RiskGroupCut, PanelLocker.LockFollowUp(train, markers, OutcomeKindLockedPanels.ForestOptions(), Options).RiskGroupCut);
    }

    [Fact]
    public void An_unmeasured_marker_is_reported_with_its_effect_on_the_scores()
    {
        var (train, test) = OutcomeKindLockedPanels.Survival();
        var locked = PanelLocker.LockFollowUp(train, [0, 1, 2], OutcomeKindLockedPanels.ForestOptions(), Options);
        var columns = new float[test.Matrix.FeatureCount][];
        var states = new CellState[]?[test.Matrix.FeatureCount];
        for (int f = 0; f < columns.Length; f++) columns[f] = test.Matrix.Column(f).ToArray();
        states[0] = Enumerable.Repeat(CellState.Missing, test.SampleCount).ToArray();
        var unmeasured = new FeatureMatrix(test.Matrix.FeatureNames, test.Matrix.SampleIds, columns, states);

        var scores = LockedPanelScorer.ScoreFollowUp(locked, unmeasured);

        var warning = Assert.Single(scores.Warnings);
        Assert.True(warning.Unmeasured);
        Assert.Contains("x1 is missing in every sample of the new cohort", warning.Message);
        Assert.Contains("risk groups would change", warning.Message);
    }

    [Fact]
    public void One_thread_and_two_threads_lock_the_same_trees()
    {
        var (train, _) = OutcomeKindLockedPanels.Friedman();
        var one = PanelLocker.LockMeasured(train, [0, 1, 2, 3, 4], OutcomeKindLockedPanels.ForestOptions(threads: 1), Options);
        var two = PanelLocker.LockMeasured(train, [0, 1, 2, 3, 4], OutcomeKindLockedPanels.ForestOptions(threads: 2), Options);
        for (int t = 0; t < one.Trees.Count; t++) Assert.Equal(one.Trees[t].NodeMeans.ToArray(), two.Trees[t].NodeMeans.ToArray());
        Assert.Equal(one.OutOfBagRSquared, two.OutOfBagRSquared);
    }
}
