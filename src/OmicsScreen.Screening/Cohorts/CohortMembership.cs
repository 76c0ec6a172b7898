using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Which samples belong to which cohort, and which cohorts are large enough for a screen of their
/// own or to be held out. The work plan and the cohort check both ask here, so they plan and run
/// the same inner screens.
/// </summary>
internal static class CohortMembership
{
    /// <summary>A cohort gets its own screen (and is held out) only with this many samples in every class.</summary>
    public const int MinimumSamplesPerClass = 5;

    /// <summary>
    /// ... or, for a measured outcome, this many samples: a Spearman correlation or a
    /// regression forest on fewer says little (common practice).
    /// </summary>
    public const int MinimumMeasuredSamples = 20;

    /// <summary>
    /// ... or, for follow-up, this many events: the usual rule of thumb of about 10 events per
    /// predictor for a Cox model (common practice; Peduzzi et al. 1995).
    /// </summary>
    public const int MinimumEvents = 10;

    /// <summary>The samples of each cohort, by cohort level.</summary>
    public static int[][] RowsOf(Panel panel)
    {
        var cohort = panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");
        var levels = cohort.SampleLevels;
        var rows = new List<int>[cohort.LevelCount];
        for (int c = 0; c < rows.Length; c++) rows[c] = [];
        for (int s = 0; s < levels.Length; s++) rows[levels[s]].Add(s);
        return rows.Select(r => r.ToArray()).ToArray();
    }

    /// <summary>Cohorts large enough for a screen of their own (<see cref="LargeEnough"/>).</summary>
    public static int[] ScreenableCohorts(Panel panel, int[][] rowsOf) =>
        Enumerable.Range(0, rowsOf.Length).Where(c => LargeEnough(panel, rowsOf[c])).ToArray();

    /// <summary>Screenable cohorts whose complement is also large enough to be screened and scored on them.</summary>
    public static int[] HeldOutCohorts(Panel panel, int[] screenable) =>
        screenable.Where(c => LargeEnough(panel, TrainingRowsWithout(panel, c))).ToArray();

    /// <summary>
    /// Whether these samples are enough for a screen of their own, by the outcome kind's rule:
    /// <see cref="MinimumSamplesPerClass"/> in every class, <see cref="MinimumMeasuredSamples"/>
    /// samples, or <see cref="MinimumEvents"/> events.
    /// </summary>
    public static bool LargeEnough(Panel panel, int[] rows)
    {
        switch (panel.Kind)
        {
            case OutcomeKind.Measured:
                // Every sample of a measured outcome has a value (the loader refuses a panel otherwise).
                return rows.Length >= MinimumMeasuredSamples;
            case OutcomeKind.TimeToEvent:
                {
                    var events = panel.FollowUp!.Events;
                    int count = 0;
                    foreach (int row in rows) if (events[row]) count++;
                    return count >= MinimumEvents;
                }
            default:
                return HasEnoughOfEachClass(rows, panel.Outcome);
        }
    }

    /// <summary>All samples outside cohort <paramref name="held"/>.</summary>
    public static int[] TrainingRowsWithout(Panel panel, int held)
    {
        var levels = panel.Cohort!.SampleLevels;
        var rows = new List<int>(levels.Length);
        for (int s = 0; s < levels.Length; s++) if (levels[s] != held) rows.Add(s);
        return rows.ToArray();
    }

    private static bool HasEnoughOfEachClass(int[] rows, ClassOutcome outcome)
    {
        var counts = new int[outcome.ClassCount];
        foreach (int row in rows) counts[outcome.SampleClasses[row]]++;
        return counts.All(n => n >= MinimumSamplesPerClass);
    }
}
