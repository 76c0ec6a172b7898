using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>Promises of the screen that users rely on without checking: thread-count invariance and names that never become paths.</summary>
public sealed class ScreenGuaranteeTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void The_whole_screen_writes_byte_identical_tables_on_one_two_and_four_threads()
    {
        // Cohorts from a column of the open data, so the cohort check runs as well.
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        var outputs = new List<string>();
        foreach (var threads in new[] { "1", "2", "4" })
        {
            string results = Path.Combine(_folder.Path, "t" + threads);
            var run = CliHarness.Run("screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--samples", sheet, "--cohort", "group",
                "--out", results, "--threads", threads, "--pairs", "3", "--trees", "60", "--curve-folds", "3", "--curve-inner-pairs", "2",
                "--max-panel-size", "5", "--quiet");
            Assert.True(run.ExitCode == ExitCode.Success, run.Error);
            outputs.Add(results);
        }
        foreach (var table in ScreenFixtures.ComparedTables)
        {
            var first = File.ReadAllBytes(Path.Combine(outputs[0], table));
            Assert.Equal(first, File.ReadAllBytes(Path.Combine(outputs[1], table)));
            Assert.Equal(first, File.ReadAllBytes(Path.Combine(outputs[2], table)));
        }
    }

    [Fact]
    public void A_cohort_named_like_a_path_creates_nothing_outside_the_results_folder()
    {
        string work = Path.Combine(_folder.Path, "work");
        Directory.CreateDirectory(work);
        string sheet = _folder.File("sheet.csv", "sample_id,group\n" + string.Join("\n",
            Enumerable.Range(1, 569).Select(i => $"S{i:D4},{(i % 2 == 0 ? "../../etc" : "/tmp/x")}")) + "\n");
        var before = Directory.GetFileSystemEntries(_folder.Path, "*", SearchOption.AllDirectories).ToHashSet();
        string results = Path.Combine(work, "results");
        var run = CliHarness.Run("screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--samples", sheet, "--cohort", "group",
            "--out", results, "--pairs", "2", "--trees", "40", "--curve-folds", "0", "--curve-inner-pairs", "1", "--quiet");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        var created = Directory.GetFileSystemEntries(_folder.Path, "*", SearchOption.AllDirectories).Where(p => !before.Contains(p)).ToList();
        Assert.All(created, path => Assert.StartsWith(results, path));
        Assert.Empty(Directory.GetDirectories(results));
        Assert.False(Directory.Exists(Path.Combine(_folder.Path, "etc")));
        Assert.Contains("../../etc", File.ReadAllText(Path.Combine(results, "cohort_effects.tsv")));
    }
}
