using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Screen;

/// <summary>The screen against known truth, on simulated panels (design in CausalBlockPanel).</summary>
public class ScreenRunnerTests
{
    /// <summary>Settings small enough for a unit test; the defaults are exercised by the benchmark and the demo.</summary>
    private static ScreenOptions QuickOptions(ulong seed) => new()
    {
        Seed = seed,
        HalfSamplePairs = 10,
        TreesPerForest = 500,
        CurveFolds = 0,
    };

    [Fact]
    public void The_shortlist_recovers_detectable_causal_features_with_few_false_discoveries()
    {
        // Design: n = 100, p = 5,000, 30 causal features in 6 correlated blocks of 10 (5 causal + 5
        // correlated noise each), effects 0.6-1.2 SD, the rest noise in blocks (rho = 0.5).
        // "Detectable" = causal features a univariate rank test finds at BH q <= 0.05 on the same data.
        double recoveredShare = 0, falseDiscoveryProportion = 0;
        const int seeds = 3;
        for (ulong seed = 1; seed <= seeds; seed++)
        {
            var (panel, causal) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { FeatureCount = 5000, Seed = seed });
            var result = ScreenRunner.Run(panel, QuickOptions(seed));
            var detectable = Enumerable.Range(0, panel.FeatureCount)
                .Where(f => causal[f] && result.Univariate.Row(f, 0).QValue <= 0.05).ToHashSet();
            var shortlisted = result.Shortlist.Select(e => e.Forest.FeatureIndex).ToList();
            int recovered = detectable.Count(f => shortlisted.Contains(f));
            recoveredShare += detectable.Count == 0 ? 1 : (double)recovered / detectable.Count;
            falseDiscoveryProportion += shortlisted.Count == 0 ? 0 : (double)shortlisted.Count(f => !causal[f]) / shortlisted.Count;
        }
        recoveredShare /= seeds;
        falseDiscoveryProportion /= seeds;
        Assert.True(recoveredShare >= 0.8, $"recovered {recoveredShare:P0} of the detectable causal features (false discovery proportion {falseDiscoveryProportion:P0})");
        // Nominal level 0.10 (the q-value threshold) plus a slack of 0.05 for three seeds.
        Assert.True(falseDiscoveryProportion <= 0.15, $"false discovery proportion {falseDiscoveryProportion:P0}");
    }

    [Fact]
    public void The_selection_aware_panel_size_curve_stays_at_chance_on_a_null_panel_while_the_optimistic_one_does_not()
    {
        // Ambroise & McLachlan (2002): selecting features on all samples and then cross-validating
        // the panel is biased upwards; selecting inside each fold is not.
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { Null = true, SampleCount = 50, FeatureCount = 1500, Seed = 7 });
        var result = ScreenRunner.Run(panel, QuickOptions(3) with
        {
            HalfSamplePairs = 5, TreesPerForest = 100, CurveFolds = 5, CurveInnerPairs = 3, CurveMaxPanelSize = 8,
        });
        var curve = result.PanelSize!;
        foreach (var point in curve.Points)
            Assert.InRange(point.SelectionAwareAuc, 0.5 - 2.5 * point.SelectionAwareAucSd - 0.05, 0.5 + 2.5 * point.SelectionAwareAucSd + 0.05);
        double selectionAware = curve.Points.Average(p => p.SelectionAwareAuc), optimistic = curve.Points.Average(p => p.OptimisticAuc);
        Assert.InRange(selectionAware, 0.35, 0.62);
        Assert.True(optimistic > 0.62 && optimistic > selectionAware + 0.1,
            $"optimistic AUC {optimistic:0.000} should be visibly above chance and above the selection-aware {selectionAware:0.000}");
    }

    [Fact]
    public void The_screen_gives_identical_results_on_one_and_two_threads()
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 60, FeatureCount = 200, Seed = 5 });
        var options = QuickOptions(9) with { HalfSamplePairs = 3, TreesPerForest = 60, CurveFolds = 3, CurveInnerPairs = 2, CurveMaxPanelSize = 5 };
        var one = ScreenRunner.Run(panel, options with { ThreadCount = 1 });
        var two = ScreenRunner.Run(panel, options with { ThreadCount = 2 });
        Assert.Equal(one.Repeats.Corrected, two.Repeats.Corrected);
        Assert.Equal(one.Repeats.Permutation, two.Repeats.Permutation);
        Assert.Equal(one.Features, two.Features);
        Assert.Equal(one.Shortlist.Select(e => e.Forest.Feature), two.Shortlist.Select(e => e.Forest.Feature));
        Assert.Equal(one.PanelSize!.Points, two.PanelSize!.Points);
        // Effect shapes and interaction partners (issue 19): curves, bands, shape words, the scan's pairs.
        Assert.NotEmpty(one.Effects.Markers);
        Assert.Equal(one.Effects.Markers.Count, two.Effects.Markers.Count);
        for (int i = 0; i < one.Effects.Markers.Count; i++)
        {
            var (a, b) = (one.Effects.Markers[i], two.Effects.Markers[i]);
            Assert.Equal(a.Curve.Individual, b.Curve.Individual);
            Assert.Equal(a.Curve.Average, b.Curve.Average);
            Assert.Equal(a.Curve.Lower, b.Curve.Lower);
            Assert.Equal(a.Curve.Upper, b.Curve.Upper);
            Assert.Equal(a.Shape, b.Shape);
            Assert.Equal(a.Partners, b.Partners);
        }
        Assert.Equal(one.Effects.Partners.Pairs, two.Effects.Partners.Pairs);
        Assert.Equal(one.Effects.SmallestEffect, two.Effects.SmallestEffect);
        Assert.Equal(one.Effects.Surfaces.Select(s => s.Average), two.Effects.Surfaces.Select(s => s.Average));
    }

    [Fact]
    public void Settings_resolve_automatic_choices_against_the_panel()
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 20, FeatureCount = 2000, CaseFraction = 0.25 });
        var settings = ScreenSettings.Resolve(new ScreenOptions(), panel);
        Assert.Equal(2000, settings.DecoyCount);
        Assert.Equal(44, settings.FeaturesPerSplit);
        // Each forest kind resolves on its own width (Breiman's floor(sqrt(columns)), common
        // practice): the corrected forest has 2 x 2,000 features + 2,000 decoys = 6,000 columns,
        // floor(sqrt(6000)) = 77; no outcome-permutation forests are grown by default.
        Assert.Equal(77, settings.CorrectedForestFeaturesPerSplit);
        Assert.Equal(0, settings.OutcomePermutationForestFeaturesPerSplit);
        // The outcome-permutation forests carry the copies only: floor(sqrt(4000)) = 63.
        Assert.Equal(63, ScreenSettings.Resolve(new ScreenOptions { OutcomePermutations = 10 }, panel).OutcomePermutationForestFeaturesPerSplit);
        // A value given by the user is tried in every forest kind.
        var given = ScreenSettings.Resolve(new ScreenOptions { FeaturesPerSplit = 30, OutcomePermutations = 10 }, panel);
        Assert.Equal((30, 30, 30), (given.FeaturesPerSplit, given.CorrectedForestFeaturesPerSplit, given.OutcomePermutationForestFeaturesPerSplit));
        Assert.True(settings.ClassBalanced);
        // One decoy per feature within the automatic floor and ceiling.
        var capped = ScreenSettings.Resolve(new ScreenOptions { AutomaticDecoyCeiling = 1000 }, panel);
        Assert.Equal(1000, capped.DecoyCount);
        var (narrow, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 20, FeatureCount = 80 });
        Assert.Equal(1000, ScreenSettings.Resolve(new ScreenOptions(), narrow).DecoyCount);
    }

    [Fact]
    public void A_repeat_selects_features_above_the_upper_quantile_of_its_decoys()
    {
        // Decoys {0.05, -0.3, 0.12, 0}: sorted, the 0.75 quantile (Hyndman-Fan type 1, the
        // ceil(0.75 x 4) = 3rd value) is 0.05, so features and decoys above 0.05 are selected.
        var repeats = new RepeatImportances(1, 5, 4);
        double[] features = [0.5, 0.15, 0.1, -0.2, -0.1];
        features.CopyTo(repeats.Corrected, 0);
        double[] decoys = [0.05, -0.3, 0.12, 0];
        decoys.CopyTo(repeats.DecoyCorrected, 0);
        RepeatScreen.Select(repeats, 0, level: 0.25, cap: 0);
        Assert.Equal([true, true, true, false, false], repeats.Selected);
        Assert.Equal([false, false, true, false], repeats.DecoySelected);

        // Without decoys the null is the mirrored non-positive importances {-0.2, 0.2, -0.1, 0.1}
        // (Janitza et al. 2018): its 0.75 quantile is 0.1.
        var alone = new RepeatImportances(1, 5, 0);
        features.CopyTo(alone.Corrected, 0);
        RepeatScreen.Select(alone, 0, level: 0.25, cap: 0);
        Assert.Equal([true, true, false, false, false], alone.Selected);

        var capped = new RepeatImportances(1, 5, 0);
        features.CopyTo(capped.Corrected, 0);
        RepeatScreen.Select(capped, 0, level: 0.25, cap: 1);
        Assert.Equal([true, false, false, false, false], capped.Selected);
    }

    [Fact]
    public void The_size_grid_follows_fibonacci_steps_and_ends_at_the_limit()
    {
        Assert.Equal([1, 2, 3, 5, 8, 13, 21, 34, 55], PanelSizeEstimator.SizeGrid(55));
        Assert.Equal([1, 2, 3, 5, 8, 10], PanelSizeEstimator.SizeGrid(10));
        Assert.Equal([1], PanelSizeEstimator.SizeGrid(1));
    }
}
