using OmicsScreen.Screening.Effects;
using OmicsScreen.TestSupport;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Screen;

/// <summary>
/// The screen on measured and time-to-event outcomes against known truth: panels simulated with
/// planted markers (a design of our own; the answers are known by construction, common practice
/// for checking a screen), and null panels where the outcome ignores every feature.
/// </summary>
public class OutcomeKindScreenTests
{
    private static ScreenOptions Quick(ulong seed) => new()
    {
        Seed = seed,
        HalfSamplePairs = 6,
        TreesPerForest = 150,
        CurveFolds = 0,
    };

    // Panels: TestSupport/OutcomeKindPanels (markers 0-2 planted, the rest noise).

    [Fact]
    public void A_measured_outcome_screen_shortlists_the_planted_markers_with_their_direction()
    {
        var result = ScreenRunner.Run(OutcomeKindPanels.Measured(160, 80, 11, planted: true), Quick(3));
        var shortlisted = result.Shortlist.Select(e => e.Forest.FeatureIndex).ToList();
        Assert.Contains(0, shortlisted);
        Assert.Contains(1, shortlisted);
        Assert.Contains(2, shortlisted);
        // At q <= 0.10 with 77 noise features, more than 3 false markers would be far beyond the level.
        Assert.True(shortlisted.Count(f => f > 2) <= 3, $"false markers: {shortlisted.Count(f => f > 2)}");
        Assert.Equal(OutcomeKind.Measured, result.Kind);
        Assert.Equal("rises with the outcome", result.Shortlist.First(e => e.Forest.FeatureIndex == 0).Measured!.Direction);
        Assert.Null(result.Shortlist[0].Univariate);
        Assert.Equal(80, result.MeasuredMarkers.Count);
        // The planted model explains about 0.66 of the outcome's variance; a forest trying 8 of 80
        // mostly-noise features per split recovers far less (0.16 measured with this seed). The check is
        // that the out-of-bag R² is clearly positive and below the truth; the bounds come from measurement.
        Assert.InRange(result.ReferenceForest.OutOfBagRSquared!.Value, 0.08, 0.66);
        // Effect shapes (issue 19) on the forest's mean: marker 2's planted step at z = 0.5, i.e. at
        // 5 + 0.5 = 5.5 in its units (the simulation's known truth); marker 0's linear effect rises.
        AssertStepsNear(result, 2, 5.5);
        Assert.Contains(result.Effects.Of(0)!.Shape.Kind, new[] { EffectShapeKind.Rises, EffectShapeKind.RisesAbove });
    }

    /// <summary>The marker's curve reads "rises above about X" with X within one grid step of the planted threshold.</summary>
    private static void AssertStepsNear(ScreenResult result, int feature, double threshold)
    {
        var effect = result.Effects.Of(feature)!;
        Assert.Equal(EffectShapeKind.RisesAbove, effect.Shape.Kind);
        var grid = effect.Curve.GridValues;
        int at = Array.FindIndex(grid, v => v >= effect.Shape.Step);
        Assert.InRange(effect.Shape.Step, threshold - (grid[at] - grid[at - 1]), threshold + (grid[at] - grid[at - 1]));
    }

    [Fact]
    public void A_time_to_event_screen_shortlists_the_planted_hazard_markers_with_their_direction()
    {
        var result = ScreenRunner.Run(OutcomeKindPanels.FollowUp(200, 80, 12, planted: true), Quick(4));
        var shortlisted = result.Shortlist.Select(e => e.Forest.FeatureIndex).ToList();
        Assert.Contains(0, shortlisted);
        Assert.Contains(1, shortlisted);
        Assert.True(shortlisted.Count(f => f > 2) <= 3, $"false markers: {shortlisted.Count(f => f > 2)}");
        Assert.Equal("higher values, shorter survival", result.Shortlist.First(e => e.Forest.FeatureIndex == 0).FollowUp!.Direction);
        Assert.InRange(result.ReferenceForest.OutOfBagConcordance!.Value, 0.6, 0.9);
        Assert.Equal(result.ReferenceForest.OutOfBagError, 1 - result.ReferenceForest.OutOfBagConcordance!.Value, 12);
        // Effect shapes (issue 19) on the forest's mortality: marker 2's planted hazard step at 5.5.
        AssertStepsNear(result, 2, 5.5);
        Assert.Contains(result.Effects.Of(0)!.Shape.Kind, new[] { EffectShapeKind.Rises, EffectShapeKind.RisesAbove });
    }

    [Theory]
    [InlineData(OutcomeKind.Measured)]
    [InlineData(OutcomeKind.TimeToEvent)]
    public void On_null_panels_the_shortlist_is_empty_or_nearly(OutcomeKind kind)
    {
        // Outcome independent of all 80 features: at q <= 0.10 a list is rarely non-empty, and never long.
        int total = 0;
        for (ulong seed = 21; seed <= 23; seed++)
        {
            var panel = kind == OutcomeKind.Measured ? OutcomeKindPanels.Measured(100, 80, seed, planted: false) : OutcomeKindPanels.FollowUp(100, 80, seed, planted: false);
            total += ScreenRunner.Run(panel, Quick(seed)).Shortlist.Count;
        }
        Assert.True(total <= 2, $"{total} markers shortlisted over three null panels");
    }

    [Theory]
    [InlineData(OutcomeKind.TimeToEvent)]
    public void A_shuffled_outcome_gives_an_empty_shortlist_in_at_least_9_of_10_seeds(OutcomeKind kind)
    {
        // Issues 17 and 18 (known truth): the planted outcome shuffled over the samples is unrelated
        // to every feature, so any list is false; under this global null Benjamini-Hochberg at 0.10
        // gives a non-empty list with probability at most 0.10 (Benjamini & Hochberg 1995).
        // The measured kind is not run here: on these seeds it lists one marker in 2 of 10 (seeds 4
        // and 7), and over 1,000 such shuffled panels (seeds 1-1,000, these options; `calibration
        // shuffled` of the benchmark program, 2026-12-05) it lists in 9.5% (Wilson 95% interval
        // 7.8-11.5%), the level Benjamini-Hochberg promises under the global null. At a list rate of
        // 9.5%, 2 or more lists in 10 panels has probability 0.25 (binomial), so no rule at the
        // nominal level can promise 9 of 10; the measured kind's rate is checked at a sample size
        // that can tell a valid rule from a liberal one instead (next test).
        int nonEmpty = 0;
        var lists = new List<int>();
        for (ulong seed = 1; seed <= 10; seed++)
        {
            var planted = kind == OutcomeKind.Measured ? OutcomeKindPanels.Measured(100, 60, 80 + seed, planted: true) : OutcomeKindPanels.FollowUp(100, 60, 80 + seed, planted: true);
            var result = ScreenRunner.Run(OutcomeKindPanels.Shuffled(planted, seed), Quick(seed));
            lists.Add(result.Shortlist.Count);
            if (result.Shortlist.Count > 0) nonEmpty++;
        }
        Assert.True(nonEmpty <= 1, $"non-empty lists in {nonEmpty} of 10 shuffled panels (lengths {string.Join(", ", lists)})");
    }

    [Fact]
    public void A_shuffled_measured_outcome_gives_lists_at_no_more_than_the_nominal_rate_over_30_seeds()
    {
        // Known truth: the shuffled outcome is unrelated to every feature, and under this global null
        // Benjamini-Hochberg at 0.10 gives a non-empty list with probability at most 0.10 (Benjamini &
        // Hochberg 1995). With 30 panels, a rule at that rate gives more than 6 lists with probability
        // 0.026 (binomial tail); a rule listing in a quarter of null panels passes with probability
        // 0.35 only. Measured on these seeds 2026-12-05: 5 of 30 (seeds 4, 7, 23, 26, 30); over
        // 1,000 seeds 9.5% (benchmark program, `calibration shuffled`).
        int nonEmpty = 0;
        var listed = new List<ulong>();
        for (ulong seed = 1; seed <= 30; seed++)
        {
            var result = ScreenRunner.Run(OutcomeKindPanels.Shuffled(OutcomeKindPanels.Measured(100, 60, 80 + seed, planted: true), seed), Quick(seed));
            if (result.Shortlist.Count == 0) continue;
            nonEmpty++;
            listed.Add(seed);
        }
        Assert.True(nonEmpty <= 6, $"non-empty lists in {nonEmpty} of 30 shuffled measured panels (seeds {string.Join(", ", listed)})");
    }

    [Fact]
    public void The_panel_size_curve_is_in_r_squared_near_zero_on_a_null_and_clearly_positive_with_planted_markers()
    {
        var options = Quick(5) with { CurveFolds = 4, CurveInnerPairs = 3, CurveMaxPanelSize = 5, TreesPerForest = 100 };
        var planted = ScreenRunner.Run(OutcomeKindPanels.Measured(160, 40, 31, planted: true), options).PanelSize!;
        Assert.Equal("r_squared", planted.Metric);
        Assert.True(planted.Points.Max(p => p.SelectionAwareAuc) > 0.3, "planted: best selection-aware R² should be well above 0");
        var nullCurve = ScreenRunner.Run(OutcomeKindPanels.Measured(100, 40, 32, planted: false), options).PanelSize!;
        // Held-out R² of a useless panel is at or below 0 (sklearn r2_score is negative when worse than the test mean).
        Assert.All(nullCurve.Points, p => Assert.True(p.SelectionAwareAuc < 0.1, $"size {p.PanelSize}: R² {p.SelectionAwareAuc:0.000}"));
    }

    [Fact]
    public void A_fold_panel_that_takes_the_locked_length_is_the_inner_list_continued_down_the_inner_order()
    {
        // The rule as documented on ScreenOutcome.FoldPanelsTakeLockedLength: list members first
        // (in list order), then the inner order's unlisted features, never a feature twice.
        var inner = new OmicsScreen.Screening.Work.InnerScreenResult(Order: [5, 3, 9, 1, 7], MeanCorrected: new double[10], Shortlist: [3, 1]);
        Assert.Equal([3], PanelSizeEstimator.ListThenOrder(inner, 1));
        Assert.Equal([3, 1], PanelSizeEstimator.ListThenOrder(inner, 2));
        Assert.Equal([3, 1, 5, 9], PanelSizeEstimator.ListThenOrder(inner, 4));
        var empty = new OmicsScreen.Screening.Work.InnerScreenResult(Order: [5, 3, 9], MeanCorrected: new double[10], Shortlist: []);
        Assert.Equal([5, 3], PanelSizeEstimator.ListThenOrder(empty, 2));
    }

    [Theory]
    [InlineData(OutcomeKind.Measured)]
    [InlineData(OutcomeKind.TimeToEvent)]
    public void With_a_non_empty_list_every_curve_fold_of_a_measured_or_follow_up_screen_scores_a_panel(OutcomeKind kind)
    {
        // Few samples, so inner screens on 4/5 of them with one pair often list nothing: the folds
        // must still score a panel of the locked list's length (the procedure whose panel is
        // locked), not chance. With folds capped at their own list (the class rule), 2 (measured)
        // and 4 (follow-up) of these 5 folds scored chance (measured on this panel before the change).
        var panel = kind == OutcomeKind.Measured ? OutcomeKindPanels.Measured(60, 30, 71, planted: true) : OutcomeKindPanels.FollowUp(60, 30, 71, planted: true);
        var options = Quick(8) with { CurveFolds = 5, CurveInnerPairs = 1, CurveMaxPanelSize = 5, TreesPerForest = 80 };
        var result = ScreenRunner.Run(panel, options);
        Assert.NotEmpty(result.Shortlist);
        var curve = result.PanelSize!;
        Assert.Equal(0, curve.FoldsWithoutPanel);
        Assert.True(curve.MeanFoldPanelSize >= 1, $"mean fold panel {curve.MeanFoldPanelSize}");
    }

    [Fact]
    public void The_time_to_event_curve_is_in_concordance()
    {
        var options = Quick(6) with { CurveFolds = 3, CurveInnerPairs = 2, CurveMaxPanelSize = 3, TreesPerForest = 80 };
        var curve = ScreenRunner.Run(OutcomeKindPanels.FollowUp(150, 30, 41, planted: true), options).PanelSize!;
        Assert.Equal("concordance", curve.Metric);
        Assert.True(curve.Points.Max(p => p.SelectionAwareAuc) > 0.6, string.Join("; ", curve.Points.Select(p => $"{p.PanelSize}: {p.SelectionAwareAuc:0.000} opt {p.OptimisticAuc:0.000}")));
        Assert.All(curve.Points, p => Assert.Equal(1 - p.SelectionAwareAuc, p.SelectionAwareError, 12));
    }

    [Theory]
    [InlineData(OutcomeKind.Measured)]
    [InlineData(OutcomeKind.TimeToEvent)]
    public void Measured_and_time_to_event_screens_are_identical_on_one_and_two_threads(OutcomeKind kind)
    {
        var panel = kind == OutcomeKind.Measured ? OutcomeKindPanels.Measured(60, 30, 51, planted: true) : OutcomeKindPanels.FollowUp(60, 30, 52, planted: true);
        var options = Quick(7) with { HalfSamplePairs = 2, TreesPerForest = 40, CurveFolds = 3, CurveInnerPairs = 2, CurveMaxPanelSize = 3 };
        var one = ScreenRunner.Run(panel, options with { ThreadCount = 1 });
        var two = ScreenRunner.Run(panel, options with { ThreadCount = 2 });
        Assert.Equal(one.Repeats.Corrected, two.Repeats.Corrected);
        Assert.Equal(one.Repeats.Permutation, two.Repeats.Permutation);
        Assert.Equal(one.Repeats.DecoyCorrected, two.Repeats.DecoyCorrected);
        Assert.Equal(one.Features, two.Features);
        Assert.Equal(one.PanelSize!.Points, two.PanelSize!.Points);
        // Effect curves and the partner scan (issue 19) too.
        Assert.Equal(one.Effects.Markers.Select(m => m.Curve.Individual), two.Effects.Markers.Select(m => m.Curve.Individual));
        Assert.Equal(one.Effects.Partners.Pairs, two.Effects.Partners.Pairs);
    }

    [Fact]
    public void Measured_outcomes_are_stratified_by_quarters_and_follow_up_by_event_status()
    {
        var y = new double[] { 5, 1, 9, 3, 7, 2, 8, 4 };
        var strata = ResamplingStrata.Of(new MeasuredOutcome("y", y));
        // Ranks 0..7 -> floor(4 r / 8): the two smallest values in quarter 0, the two largest in quarter 3.
        Assert.Equal(new[] { 2, 0, 3, 1, 2, 0, 3, 1 }, strata.SampleStrata.ToArray());
        var followUp = ResamplingStrata.Of(new FollowUpOutcome("t", "e", [1, 2, 3, 4], [true, false, false, true]));
        Assert.Equal(new[] { 1, 0, 0, 1 }, followUp.SampleStrata.ToArray());

        // Every outer fold of a follow-up keeps its share of events within one of the average.
        var panel = OutcomeKindPanels.FollowUp(90, 5, 61, planted: false);
        int events = panel.FollowUp!.EventCount;
        var folds = StratifiedFolds.Draw(ResamplingStrata.Of(panel), null, Enumerable.Range(0, 90).ToArray(), 5, 1, 3);
        foreach (var fold in folds)
        {
            int foldEvents = fold.TestRows.Count(r => panel.FollowUp.Events[r]);
            Assert.InRange(foldEvents, events / 5 - 1, events / 5 + 2);
        }
    }
}
