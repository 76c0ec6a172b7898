using System.Diagnostics;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Work;

/// <summary>
/// A screen killed part-way resumes from its checkpoint and ends with the same tables as a run
/// that was never interrupted; a checkpoint of another run is refused, not used.
/// </summary>
public sealed class ResumeTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>The open WDBC panel with three cohorts, small settings; the same for every run of a test.</summary>
    private string[] ScreenArgs(string sheet, string results, params string[] extra) =>
    [
        "screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--samples", sheet, "--cohort", "group",
        "--out", results, "--pairs", "8", "--trees", "150", "--curve-folds", "3", "--curve-inner-pairs", "2",
        "--max-panel-size", "5", "--quiet", .. extra,
    ];

    [Fact]
    public void A_screen_killed_mid_run_resumes_to_byte_identical_tables()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        string reference = Path.Combine(_folder.Path, "uninterrupted");
        var whole = CliHarness.Run(ScreenArgs(sheet, reference));
        Assert.True(whole.ExitCode == ExitCode.Success, whole.Error);

        string results = Path.Combine(_folder.Path, "killed");
        string checkpoint = Path.Combine(results, "checkpoint");
        KillOnceUnitsAreWritten(sheet, results, 3);
        int kept = UnitCount(checkpoint);
        Assert.InRange(kept, 3, 25);
        Assert.False(File.Exists(Path.Combine(results, "manifest.json")));
        Assert.False(File.Exists(Path.Combine(results, "shortlist.tsv")));

        // Without --resume the unfinished run is not silently overwritten.
        var refused = CliHarness.Run(ScreenArgs(sheet, results));
        Assert.Equal(ExitCode.OutputError, refused.ExitCode);
        Assert.Contains("--resume", refused.Error);

        // Resuming on another thread count still reproduces the uninterrupted run.
        var resumed = CliHarness.Run(ScreenArgs(sheet, results, "--resume", "--threads", "1"));
        Assert.True(resumed.ExitCode == ExitCode.Success, resumed.Error);
        Assert.Matches(@"Resumed: ([3-9]|[12]\d) of \d+ work units came from the checkpoint", resumed.Out);
        foreach (var table in ScreenFixtures.ComparedTables)
            Assert.True(File.ReadAllBytes(Path.Combine(reference, table)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(results, table))),
                $"{table} differs after resuming");
        Assert.False(Directory.Exists(checkpoint), "the checkpoint is removed once the results are complete");
    }

    [Fact]
    public void A_checkpoint_of_other_settings_or_other_data_is_refused_with_the_reason()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        string results = Path.Combine(_folder.Path, "results");
        MakeCheckpoint(sheet, results);

        var otherSettings = CliHarness.Run(ScreenArgs(sheet, results, "--resume", "--min-leaf", "2"));
        Assert.Equal(ExitCode.InputError, otherSettings.ExitCode);
        Assert.Contains("different settings", otherSettings.Error);
        Assert.Contains("min_leaf_size 1 then, 2 now", otherSettings.Error);

        // The same samples with one cohort label changed: a different panel.
        string otherSheet = _folder.File("other.csv", File.ReadAllText(sheet).Replace("S0001,b", "S0001,a"));
        var otherData = CliHarness.Run(ScreenArgs(otherSheet, results, "--resume"));
        Assert.Equal(ExitCode.InputError, otherData.ExitCode);
        Assert.Contains("different input data", otherData.Error);
        Assert.DoesNotContain("   at ", otherData.Error);
        Assert.True(UnitCount(Path.Combine(results, "checkpoint")) >= 2, "a refused resume leaves the checkpoint alone");

        // --force discards it and starts again.
        var forced = CliHarness.Run(ScreenArgs(otherSheet, results, "--force"));
        Assert.True(forced.ExitCode == ExitCode.Success, forced.Error);
    }

    [Fact]
    public void A_damaged_checkpoint_unit_is_computed_again_and_the_tables_still_match()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        string reference = Path.Combine(_folder.Path, "reference");
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenArgs(sheet, reference)).ExitCode);
        string results = Path.Combine(_folder.Path, "results");
        MakeCheckpoint(sheet, results);
        string unit = Directory.GetFiles(Path.Combine(results, "checkpoint"), "*.unit").Order(StringComparer.Ordinal).First();
        var bytes = File.ReadAllBytes(unit);
        bytes[bytes.Length / 2] ^= 0x40;
        File.WriteAllBytes(unit, bytes);

        var resumed = CliHarness.Run(ScreenArgs(sheet, results, "--resume"));
        Assert.True(resumed.ExitCode == ExitCode.Success, resumed.Error);
        Assert.Contains("SHA-256", resumed.Error);
        foreach (var table in ScreenFixtures.ComparedTables)
            Assert.Equal(File.ReadAllBytes(Path.Combine(reference, table)), File.ReadAllBytes(Path.Combine(results, table)));
    }

    /// <summary>A checkpoint as a killed run leaves it: the part of this run's work, stored, and no results.</summary>
    private void MakeCheckpoint(string sheet, string results) => KillOnceUnitsAreWritten(sheet, results, 2);

    /// <summary>
    /// Runs the screen as a process of its own and kills it (SIGKILL on Linux: no handler runs)
    /// once <paramref name="units"/> units are on disk, long before the end.
    /// </summary>
    private void KillOnceUnitsAreWritten(string sheet, string results, int units)
    {
        using var child = ChildProcess.Start(ScreenArgs(sheet, results));
        var clock = Stopwatch.StartNew();
        string checkpoint = Path.Combine(results, "checkpoint");
        while (UnitCount(checkpoint) < units && !child.HasExited && clock.Elapsed < TimeSpan.FromMinutes(3)) Thread.Sleep(5);
        Assert.False(child.HasExited, "The screen finished before it could be killed; the test needs a longer run.");
        child.Kill(entireProcessTree: true);
        child.WaitForExit();
    }

    private static int UnitCount(string folder) =>
        Directory.Exists(folder) ? Directory.GetFiles(folder, "*.unit").Length : 0;
}
