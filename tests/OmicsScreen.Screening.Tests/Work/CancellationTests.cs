using System.Diagnostics.CodeAnalysis;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Work;

/// <summary>
/// Issue 16: the inner screens of the cohort check honour the run's cancellation. Before, a
/// cohort's own screen ran to its end after the run was cancelled (it was given no token), so a
/// stopped run still spent a whole inner screen and saved it.
/// </summary>
public sealed class CancellationTests
{
    /// <summary>A store that holds nothing and cancels the run when the first cohort screen is asked for.</summary>
    private sealed class CancelAtCohortScreen(CancellationTokenSource source) : IWorkUnitStore
    {
        public List<WorkUnit> Saved { get; } = [];

        public bool TryLoad(WorkUnit unit, [NotNullWhen(true)] out WorkUnitResult? result)
        {
            if (unit.Kind == WorkUnitKind.CohortScreen) source.Cancel();
            result = null;
            return false;
        }

        public void Save(WorkUnit unit, WorkUnitResult result) => Saved.Add(unit);
    }

    [Fact]
    public void A_cancelled_run_stops_inside_a_cohort_screen_and_saves_no_cohort_unit()
    {
        var panel = CohortPanel.Generate(new CohortPanel.Design { FeatureCount = 40, Seed = 5 });
        using var source = new CancellationTokenSource();
        var store = new CancelAtCohortScreen(source);
        var options = new ScreenOptions { Seed = 3, HalfSamplePairs = 2, TreesPerForest = 30, CurveFolds = 0, CurveInnerPairs = 2 };

        Assert.ThrowsAny<OperationCanceledException>(() => ScreenRunner.Run(panel, options, cancellation: source.Token, store: store));
        Assert.Equal(options.HalfSamplePairs * 2, store.Saved.Count(u => u.Kind == WorkUnitKind.Repeat));
        Assert.DoesNotContain(store.Saved, u => u.Kind == WorkUnitKind.CohortScreen);
    }
}
