using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Leave-one-cohort-out validation, one of the cohort check's analyses: for each cohort, the
/// screen of the other cohorts locks a panel, and a forest on that panel, grown on the other
/// cohorts, is scored on the held-out one (<see cref="PanelScorer"/>, as the panel-size curve
/// scores a fold), so the held-out cohort never takes part in choosing or fitting its panel.
/// </summary>
internal static class LeaveOneCohortOut
{
    /// <param name="heldOutCohorts">Cohorts that can be held out (<see cref="CohortMembership.HeldOutCohorts"/>).</param>
    /// <param name="rowsOf">The samples of each cohort.</param>
    /// <param name="cohortDone">Told after each held-out cohort.</param>
    public static List<HeldOutCohort> Validate(ScreenContext context, ScreenWork work, CohortOutcome outcome, int[] heldOutCohorts,
        int[][] rowsOf, Action cohortDone)
    {
        var cohort = context.Panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");
        var heldOut = new List<HeldOutCohort>();
        foreach (int c in heldOutCohorts)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            var training = CohortMembership.TrainingRowsWithout(context.Panel, c);
            // The panel is what the procedure locks when the held-out cohort is not there: the other
            // cohorts' own shortlist, up to the curve's size limit; their size choice never sees it.
            var shortlist = work.HeldOutScreen(c).Shortlist;
            var panelFeatures = shortlist.AsSpan(0, Math.Min(shortlist.Length, context.Options.CurveMaxPanelSize)).ToArray();
            if (panelFeatures.Length == 0)
                heldOut.Add(new HeldOutCohort(cohort.LevelNames[c], rowsOf[c].Length, 0, double.NaN, ConfidenceInterval.Undefined(0.95), double.NaN));
            else
            {
                var seed = RandomStreams.HeldOutScreenSeed(context.Options.Seed, c);
                var scored = PanelScorer.Score(context, panelFeatures, training, rowsOf[c], RandomStreams.HeldOutScoring(seed));
                heldOut.Add(outcome.HeldOut(cohort.LevelNames[c], panelFeatures.Length, scored, rowsOf[c]));
            }
            cohortDone();
        }
        return heldOut;
    }
}
