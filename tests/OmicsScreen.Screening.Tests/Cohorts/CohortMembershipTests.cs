using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Cohorts;

namespace OmicsScreen.Screening.Tests.Cohorts;

/// <summary>
/// Which cohorts get a screen of their own, by the outcome kind's rule (common practice): 5 samples
/// of every class, 20 samples with a measured outcome, or 10 events (about 10 events per predictor,
/// Peduzzi et al. 1995).
/// </summary>
public sealed class CohortMembershipTests
{
    private static FeatureMatrix Matrix(int samples) =>
        new(["f0"], Enumerable.Range(0, samples).Select(s => "s" + s).ToArray(), [new float[samples]], new CellState[]?[1]);

    [Fact]
    public void A_measured_cohort_needs_twenty_samples()
    {
        // Cohort a: 19 samples; cohort b: 20; cohort c: 40.
        var levels = Enumerable.Repeat(0, 19).Concat(Enumerable.Repeat(1, 20)).Concat(Enumerable.Repeat(2, 40)).ToArray();
        var values = levels.Select((_, s) => (double)s).ToArray();
        var panel = new Panel(Matrix(levels.Length), new MeasuredOutcome("score", values), new SampleGrouping("centre", ["a", "b", "c"], levels));
        var rows = CohortMembership.RowsOf(panel);
        Assert.Equal([1, 2], CohortMembership.ScreenableCohorts(panel, rows));
        // Without b the rest (a and c) still holds 59 samples, so both can be held out.
        Assert.Equal([1, 2], CohortMembership.HeldOutCohorts(panel, [1, 2]));
    }

    [Fact]
    public void A_follow_up_cohort_needs_ten_events()
    {
        // Cohort a: 30 samples, 9 events; cohort b: 30 samples, 10 events; cohort c: 30 samples, 12 events.
        var levels = Enumerable.Repeat(0, 30).Concat(Enumerable.Repeat(1, 30)).Concat(Enumerable.Repeat(2, 30)).ToArray();
        var events = levels.Select((c, s) => (s % 30) < (c == 0 ? 9 : c == 1 ? 10 : 12)).ToArray();
        var times = levels.Select((_, s) => 1.0 + s).ToArray();
        var panel = new Panel(Matrix(levels.Length), new FollowUpOutcome("months", "relapse", times, events),
            new SampleGrouping("centre", ["a", "b", "c"], levels));
        var rows = CohortMembership.RowsOf(panel);
        Assert.Equal([1, 2], CohortMembership.ScreenableCohorts(panel, rows));
        Assert.True(CohortMembership.LargeEnough(panel, rows[1]));
        Assert.False(CohortMembership.LargeEnough(panel, rows[0]));
    }
}
