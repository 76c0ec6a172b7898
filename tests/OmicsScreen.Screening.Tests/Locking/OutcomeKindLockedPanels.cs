using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Locking;

/// <summary>
/// The panels the measured and follow-up locking tests lock and score, shared with Runs' file
/// tests: Friedman's first benchmark (reference/regression, 200 rows to lock on, 100 to score) and
/// the invented survival_forest.csv (reference/survival, 140 and 60).
/// </summary>
internal static class OutcomeKindLockedPanels
{
    internal static ForestOptions ForestOptions(int threads = 0) =>
        new() { TreeCount = 120, Seed = 11, Repeat = PanelLocker.LockRepeat, ThreadCount = threads, Tree = new() { MinLeafSize = 5 } };

    internal static (Panel Train, Panel Test) Friedman()
    {
        var (matrix, outcome) = Friedman1Data.Load();
        var panel = new Panel(matrix, new MeasuredOutcome("y", outcome));
        return (panel.SelectSamples(Enumerable.Range(0, 200).ToArray()), panel.SelectSamples(Enumerable.Range(200, 100).ToArray()));
    }

    internal static (Panel Train, Panel Test) Survival()
    {
        var (matrix, followUp) = SurvivalForestData.Load();
        var panel = new Panel(matrix, new FollowUpOutcome("time", "status", followUp.Times, followUp.Events));
        return (panel.SelectSamples(Enumerable.Range(0, 140).ToArray()), panel.SelectSamples(Enumerable.Range(140, 60).ToArray()));
    }
}
