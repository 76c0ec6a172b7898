using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Work;

/// <summary>
/// A screen is made of work units that can be computed anywhere and in any order: results put
/// together from stored units equal a single run's exactly, and a damaged unit is never used.
/// </summary>
public sealed class ScreenWorkTests
{
    private static readonly byte[] Identity = Enumerable.Range(0, 32).Select(i => (byte)(i * 7)).ToArray();

    private static Panel ThreeCohorts() => CohortPanel.Generate(new CohortPanel.Design
    {
        SamplesPerCohort = 40,
        FeatureCount = 60,
        CaseShares = [0.4, 0.5, 0.5],
        Effects = [new(3, 1.5, CasesOnly: true), new(7, 1.2, CasesOnly: true)],
        Seed = 5,
    });

    private static ScreenOptions Small => new()
    {
        HalfSamplePairs = 3, TreesPerForest = 40, CurveFolds = 3, CurveInnerPairs = 2, CurveMaxPanelSize = 5, Seed = 11,
    };

    [Fact]
    public void The_plan_lists_repeats_folds_and_both_kinds_of_cohort_screen_once_each()
    {
        var panel = ThreeCohorts();
        var plan = WorkPlan.For(panel, ScreenSettings.Resolve(Small, panel));
        var units = plan.Units.Select(u => u.Unit).ToList();
        Assert.Equal(6 + 3 + 3 + 3, units.Count);
        Assert.Equal(units.Count, units.Distinct().Count());
        Assert.Equal(6, units.Count(u => u.Kind == WorkUnitKind.Repeat));
        Assert.Equal(3, units.Count(u => u.Kind == WorkUnitKind.HeldOutScreen));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(4)]
    [InlineData(15)]
    public void Parts_divide_the_plan_into_disjoint_sets_that_cover_it(int partCount)
    {
        var panel = ThreeCohorts();
        var plan = WorkPlan.For(panel, ScreenSettings.Resolve(Small, panel));
        var all = Enumerable.Range(1, partCount).SelectMany(p => plan.UnitsOfPart(p, partCount)).ToList();
        Assert.Equal(plan.Units.Select(u => u.Unit.Name).Order(StringComparer.Ordinal), all.Select(u => u.Name).Order(StringComparer.Ordinal));
        // The division is a function of the plan alone.
        Assert.Equal(plan.UnitsOfPart(1, partCount), WorkPlan.For(panel, ScreenSettings.Resolve(Small, panel)).UnitsOfPart(1, partCount));
    }

    [Fact]
    public void Parts_are_balanced_by_cost_within_the_largest_unit()
    {
        var panel = ThreeCohorts();
        var plan = WorkPlan.For(panel, ScreenSettings.Resolve(Small with { HalfSamplePairs = 10 }, panel));
        var cost = plan.Units.ToDictionary(u => u.Unit, u => u.Cost);
        var loads = Enumerable.Range(1, 4).Select(p => plan.UnitsOfPart(p, 4).Sum(u => cost[u])).ToArray();
        // Graham (1969): greedy assignment in decreasing order is never off by more than one job from balance.
        Assert.True(loads.Max() - loads.Min() <= plan.Units.Max(u => u.Cost) + 1e-9);
    }

    [Fact]
    public void A_screen_assembled_from_separately_computed_parts_equals_a_single_run_bit_for_bit()
    {
        var panel = ThreeCohorts();
        var options = Small;
        var settings = ScreenSettings.Resolve(options, panel);
        var single = ScreenRunner.Run(panel, options);

        var plan = WorkPlan.For(panel, settings);
        var merged = new MemoryUnitStore(Identity, panel.FeatureCount, settings.DecoyCount);
        for (int part = 1; part <= 3; part++)
        {
            // Each part on its own store and thread count, as on separate machines.
            var store = new MemoryUnitStore(Identity, panel.FeatureCount, settings.DecoyCount);
            ScreenRunner.RunUnits(panel, options with { ThreadCount = part }, plan.UnitsOfPart(part, 3), store);
            foreach (var (unit, bytes) in store.Units) merged.Units.Add(unit, bytes);
        }
        var joined = ScreenRunner.Run(panel, options, store: merged, computeMissing: false);

        Assert.Equal(plan.Units.Count, merged.Loads);
        AssertSameResult(single, joined);
    }

    [Fact]
    public void A_run_resumed_from_some_stored_units_equals_an_uninterrupted_run()
    {
        var panel = ThreeCohorts();
        var options = Small;
        var settings = ScreenSettings.Resolve(options, panel);
        var store = new MemoryUnitStore(Identity, panel.FeatureCount, settings.DecoyCount);
        var first = ScreenRunner.Run(panel, options, store: store);
        // Keep every other unit, as if the process had died half-way through.
        foreach (var unit in store.Units.Keys.Where((_, i) => i % 2 == 1).ToList()) store.Units.Remove(unit);
        int kept = store.Units.Count;
        var resumed = ScreenRunner.Run(panel, options with { ThreadCount = 1 }, store: store);
        Assert.Equal(kept, store.Loads);
        AssertSameResult(first, resumed);
    }

    [Fact]
    public void A_merge_with_a_unit_missing_fails_instead_of_computing_it()
    {
        var panel = ThreeCohorts();
        var settings = ScreenSettings.Resolve(Small, panel);
        var store = new MemoryUnitStore(Identity, panel.FeatureCount, settings.DecoyCount);
        var plan = WorkPlan.For(panel, settings);
        ScreenRunner.RunUnits(panel, Small, plan.UnitsOfPart(1, 2), store);
        var error = Assert.Throws<InvalidOperationException>(() => ScreenRunner.Run(panel, Small, store: store, computeMissing: false));
        Assert.Contains("none of the stored parts", error.Message);
    }

    private static void AssertSameResult(ScreenResult expected, ScreenResult actual)
    {
        Assert.Equal(expected.Repeats.Corrected, actual.Repeats.Corrected);
        Assert.Equal(expected.Repeats.Permutation, actual.Repeats.Permutation);
        Assert.Equal(expected.Repeats.Selected, actual.Repeats.Selected);
        Assert.Equal(expected.Repeats.DecoyCorrected, actual.Repeats.DecoyCorrected);
        Assert.Equal(expected.Order, actual.Order);
        Assert.Equal(expected.Features.Select(f => f.PValue), actual.Features.Select(f => f.PValue));
        Assert.Equal(expected.Shortlist.Select(e => e.Forest.Feature), actual.Shortlist.Select(e => e.Forest.Feature));
        Assert.Equal(expected.PanelSize!.Points, actual.PanelSize!.Points);
        Assert.Equal(expected.Cohorts!.Concordance, actual.Cohorts!.Concordance);
        Assert.Equal(expected.Cohorts.HeldOut, actual.Cohorts.HeldOut);
    }
}
