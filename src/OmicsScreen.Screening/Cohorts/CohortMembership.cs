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

    /// <summary>Cohorts with enough samples of every class for a screen of their own.</summary>
    public static int[] ScreenableCohorts(Panel panel, int[][] rowsOf) =>
        Enumerable.Range(0, rowsOf.Length).Where(c => HasEnoughOfEachClass(rowsOf[c], panel.Outcome)).ToArray();

    /// <summary>Screenable cohorts whose complement also has enough of every class to be screened and scored on them.</summary>
    public static int[] HeldOutCohorts(Panel panel, int[] screenable) =>
        screenable.Where(c => HasEnoughOfEachClass(TrainingRowsWithout(panel, c), panel.Outcome)).ToArray();

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
