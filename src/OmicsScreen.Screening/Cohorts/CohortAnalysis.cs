using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Checks that top markers hold across cohorts and are not cohort or batch artefacts, by running
/// the cohort check's analyses in turn: each cohort's own screen and their concordance
/// (<see cref="CohortScreenConcordance"/>), a forest that predicts the cohort
/// (<see cref="CohortPrediction"/>), the outcome-cohort association
/// (<see cref="OutcomeCohortAssociation"/>), every marker across cohorts
/// (<see cref="MarkerAcrossCohorts"/>, <see cref="HeterogeneityFlags"/>) and leave-one-cohort-out
/// validation (<see cref="LeaveOneCohortOut"/>).
/// </summary>
internal static class CohortAnalysis
{
    /// <summary>The cohort check; progress is reported per cohort screen, and every inner screen honours the context's cancellation.</summary>
    public static CohortResult Run(ScreenContext context, IReadOnlyList<int> order, SingleMarkerStatistics singleMarkers, ScreenWork work)
    {
        var panel = context.Panel;
        var cohort = panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");
        var outcome = CohortOutcome.For(context, singleMarkers);
        void Done(int step, int total) => context.Report(ScreenStage.Cohorts, step, total);
        var rowsOf = CohortMembership.RowsOf(panel);
        var screenable = CohortMembership.ScreenableCohorts(panel, rowsOf);
        var heldOutCohorts = CohortMembership.HeldOutCohorts(panel, screenable);
        int steps = screenable.Length + heldOutCohorts.Length + 1, done = 0;

        var concordance = CohortScreenConcordance.Compare(context, work, screenable, () => Done(++done, steps));

        var prediction = CohortPrediction.Grow(context, rowsOf);
        Done(++done, steps);

        var (association, associationP) = outcome.Association();

        // Every feature across cohorts, in the screen's order; features are independent, so they
        // run in parallel and are gathered by index.
        var markers = new MarkerHeterogeneity[panel.FeatureCount];
        Parallel.For(0, markers.Length, WorkerThreads.Options(context.ThreadCount),
            i => markers[i] = outcome.Marker(order[i], prediction.ImportanceRanks[order[i]], rowsOf));
        HeterogeneityFlags.Flag(markers, context.Options.QValueThreshold);

        var heldOut = LeaveOneCohortOut.Validate(context, work, outcome, heldOutCohorts, rowsOf, () => Done(++done, steps));

        return new CohortResult(cohort.ColumnName, cohort.LevelNames, screenable.Select(c => cohort.LevelNames[c]).ToArray(),
            concordance, markers, heldOut, prediction.Accuracy, prediction.LargestShare, association, associationP,
            association >= OutcomeCohortAssociation.ConfoundingStrength)
        {
            Measure = outcome.Measure,
        };
    }
}
