using System.Text.Json;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Work;

/// <summary>
/// A screen split with --part and joined with merge writes the same tables as a single run, and
/// a merge refuses parts that do not make up one whole run.
/// </summary>
public sealed class PartMergeTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static string[] ScreenArgs(string sheet, string output, params string[] extra) =>
    [
        "screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--samples", sheet, "--cohort", "group",
        "--out", output, "--pairs", "3", "--trees", "60", "--curve-folds", "3", "--curve-inner-pairs", "2",
        "--max-panel-size", "5", "--quiet", .. extra,
    ];

    private string[] RunParts(string sheet, int count, string prefix = "part", params string[] extra)
    {
        var folders = new string[count];
        for (int i = 1; i <= count; i++)
        {
            folders[i - 1] = Path.Combine(_folder.Path, $"{prefix}{i}");
            var run = CliHarness.Run(ScreenArgs(sheet, folders[i - 1], ["--part", $"{i}/{count}", .. extra]));
            Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        }
        return folders;
    }

    [Fact]
    public void Four_parts_merged_write_the_tables_of_a_single_run_byte_for_byte()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        string single = Path.Combine(_folder.Path, "single");
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenArgs(sheet, single)).ExitCode);
        // Parts on different thread counts, given to merge out of order.
        var parts = RunParts(sheet, 4, "part", "--threads", "1");
        string merged = Path.Combine(_folder.Path, "merged");
        var merge = CliHarness.Run("merge", parts[2], parts[0], parts[3], parts[1], "--out", merged, "--quiet", "--threads", "2");
        Assert.True(merge.ExitCode == ExitCode.Success, merge.Error);
        Assert.Contains("Merged 4 parts", merge.Out);
        foreach (var table in ScreenFixtures.ComparedTables)
            Assert.True(File.ReadAllBytes(Path.Combine(single, table)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(merged, table))),
                $"{table} differs between the single run and the merge");
        Assert.Contains("split into 4 parts", File.ReadAllText(Path.Combine(merged, "report.html")));
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(merged, "manifest.json")));
        Assert.Equal(4, manifest.RootElement.GetProperty("merged_from_parts").GetInt32());
        string command = manifest.RootElement.GetProperty("command_line").GetString()!;
        Assert.DoesNotContain("--part", command);
        Assert.EndsWith("--out " + merged, command);
    }

    [Fact]
    public void Every_unit_of_the_plan_is_in_exactly_one_part()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        var parts = RunParts(sheet, 3);
        var units = parts.SelectMany(p => Directory.GetFiles(p, "*.unit").Select(Path.GetFileName)).ToList();
        Assert.Equal(units.Count, units.Distinct().Count());
        // 6 repeats + 3 curve folds + 3 cohort screens + 3 held-out screens.
        Assert.Equal(15, units.Count);
        Assert.All(parts, p => Assert.InRange(Directory.GetFiles(p, "*.unit").Length, 4, 6));
    }

    [Fact]
    public void Merge_refuses_a_missing_part_a_repeated_part_and_a_part_of_another_run()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        var parts = RunParts(sheet, 3);
        var other = RunParts(sheet, 3, "other", "--seed", "9");
        string output = Path.Combine(_folder.Path, "merged");

        var missing = CliHarness.Run("merge", parts[0], parts[2], "--out", output);
        Assert.Equal(ExitCode.InputError, missing.ExitCode);
        Assert.Contains("Part 2 of 3 is missing", missing.Error);

        var twice = CliHarness.Run("merge", parts[0], parts[1], parts[1], parts[2], "--out", output);
        Assert.Equal(ExitCode.InputError, twice.ExitCode);
        Assert.Contains("given twice", twice.Error);

        var mixed = CliHarness.Run("merge", parts[0], other[1], parts[2], "--out", output);
        Assert.Equal(ExitCode.InputError, mixed.ExitCode);
        Assert.Contains("different run", mixed.Error);
        Assert.Contains("seed", mixed.Error);

        var notPart = CliHarness.Run("merge", _folder.Path, "--out", output);
        Assert.Equal(ExitCode.InputError, notPart.ExitCode);
        Assert.Contains("not a part", notPart.Error);
        Assert.False(Directory.Exists(output), "a refused merge creates no results folder");
    }

    [Fact]
    public void Merge_refuses_a_damaged_unit_and_an_input_changed_since_the_parts_ran()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        var parts = RunParts(sheet, 2);
        string output = Path.Combine(_folder.Path, "merged");
        string unit = Directory.GetFiles(parts[1], "*.unit").Order(StringComparer.Ordinal).First();
        var original = File.ReadAllBytes(unit);
        File.WriteAllBytes(unit, original[..(original.Length - 7)]);
        var damaged = CliHarness.Run("merge", parts[0], parts[1], "--out", output);
        Assert.Equal(ExitCode.InputError, damaged.ExitCode);
        Assert.Contains(Path.GetFileName(unit), damaged.Error);
        Assert.Contains("truncated", damaged.Error);
        File.WriteAllBytes(unit, original);

        File.AppendAllText(sheet, "\n");
        var changed = CliHarness.Run("merge", parts[0], parts[1], "--out", output);
        Assert.Equal(ExitCode.InputError, changed.ExitCode);
        Assert.Contains("changed since the parts ran", changed.Error);
        Assert.False(Directory.Exists(output));
    }

    [Fact]
    public void A_part_count_above_the_number_of_work_units_is_a_usage_error()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        var run = CliHarness.Run(ScreenArgs(sheet, Path.Combine(_folder.Path, "p"), "--part", "1/99"));
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("at most 15 parts", run.Error);
        var malformed = CliHarness.Run(ScreenArgs(sheet, Path.Combine(_folder.Path, "p"), "--part", "3/2"));
        Assert.Equal(ExitCode.Usage, malformed.ExitCode);
        Assert.Contains("--part takes I/N", malformed.Error);
    }
}
