namespace OmicsScreen.Cli.Tests;

/// <summary>What the tests that compare whole screens share: the files compared and a cohort sheet for the open data.</summary>
internal static class ScreenFixtures
{
    /// <summary>Every results file except the ones that record timings and the machine (report.html, manifest.json).</summary>
    public static readonly string[] ComparedTables =
    [
        "shortlist.tsv", "features.tsv", "panel_size_curve.tsv", "marker_statistics.tsv",
        "marker_statistics_by_cohort.tsv", "cohort_markers.tsv", "cohort_effects.tsv", "cohort_concordance.tsv",
        "cohort_validation.tsv", "locked_panel.json",
    ];

    /// <summary>A sample sheet giving the 569 WDBC samples three cohorts, a, b and c in turn, so the cohort check runs too.</summary>
    public static string WdbcCohortSheet(TempFolder folder) => folder.File("sheet.csv", "sample_id,group\n" + string.Join("\n",
        Enumerable.Range(1, 569).Select(i => $"S{i:D4},{(i % 3 == 0 ? "a" : i % 3 == 1 ? "b" : "c")}")) + "\n");
}
