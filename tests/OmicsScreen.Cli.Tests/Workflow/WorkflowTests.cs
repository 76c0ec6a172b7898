using System.Text.Json;

namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>
/// The shipped Snakemake workflow (workflows/snakemake) run for real: the parts it runs as separate
/// jobs merge into exactly the results a single screen writes.
/// </summary>
public sealed class WorkflowTests : IDisposable
{
    private static readonly TimeSpan TimeBound = TimeSpan.FromMinutes(5);

    /// <summary>Small settings so each job takes seconds; every part and the single run get the same ones.</summary>
    private static readonly string[] QuickSettings =
        ["--pairs", "4", "--trees", "50", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "5", "--seed", "7", "--quiet"];

    private const int PartCount = 4;

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>The tool as a separate program, the way the workflow starts it.</summary>
    private static string ToolAssembly
    {
        get
        {
            string path = Path.Combine(AppContext.BaseDirectory, "omicsscreen.dll");
            Assert.True(File.Exists(path), "omicsscreen.dll is not in the test output folder");
            return path;
        }
    }

    [Fact]
    public void Four_parts_run_by_snakemake_merge_into_the_tables_of_a_single_screen()
    {
        if (!SnakemakeTool.AvailableOrFailOnCi()) return;
        var deadline = DateTime.UtcNow + TimeBound;
        var panel = WorkflowPanel.Write(_folder.Path);

        string single = Path.Combine(_folder.Path, "single");
        var singleRun = ChildProcess.Run("dotnet",
            [ToolAssembly, "screen", panel.Matrix, "--samples", panel.SampleSheet, "--outcome", WorkflowPanel.OutcomeColumn,
             "--cohort", WorkflowPanel.CohortColumn, .. QuickSettings, "--threads", "2", "--out", single],
            _folder.Path, deadline);
        Assert.True(singleRun.Succeeded, singleRun.Output);

        string merged = Path.Combine(_folder.Path, "merged");
        var workflowRun = RunSnakemake(WriteConfig(panel, merged), deadline, "--cores", "2");
        Assert.True(workflowRun.Succeeded, workflowRun.Output + LogsOf(merged));

        var singleFiles = ComparedFiles(single);
        Assert.Contains("shortlist.tsv", singleFiles);
        Assert.Contains("locked_panel.json", singleFiles);
        Assert.Equal(singleFiles, ComparedFiles(merged));
        foreach (var file in singleFiles)
            Assert.True(File.ReadAllBytes(Path.Combine(single, file)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(merged, file))),
                file + " differs between the single screen and the merged parts");

        Assert.Contains(PartCount + " parts", File.ReadAllText(Path.Combine(merged, "report.html")));
        for (int part = 1; part <= PartCount; part++)
        {
            Assert.True(File.Exists(Path.Combine(merged + ".parts", $"{part}-of-{PartCount}", "part.json")), $"part {part} folder");
            Assert.True(File.Exists(Path.Combine(merged + ".logs", $"part-{part}-of-{PartCount}.log")), $"part {part} log");
        }
        Assert.True(File.Exists(Path.Combine(merged + ".logs", "merge.log")));
    }

    [Fact]
    public void The_slurm_profile_plans_one_job_per_part_and_one_merge_without_changing_the_workflow()
    {
        if (!SnakemakeTool.AvailableOrFailOnCi()) return;
        var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(2);
        var panel = WorkflowPanel.Write(_folder.Path);

        // A dry run submits nothing: it proves Snakemake 7 accepts the profile and plans the jobs.
        var plan = RunSnakemake(WriteConfig(panel, Path.Combine(_folder.Path, "merged")), deadline,
            "--profile", RepositoryFolder.Workflows("snakemake", "profiles", "slurm"), "--dry-run");
        Assert.True(plan.Succeeded, plan.Output);
        Assert.Matches(@"screen_part\s+" + PartCount + @"\b", plan.Output);
        Assert.Matches(@"merge_parts\s+1\b", plan.Output);
    }

    [Fact]
    public void The_workflow_refuses_screen_arguments_that_each_job_must_set_itself()
    {
        if (!SnakemakeTool.AvailableOrFailOnCi()) return;
        var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(2);
        var panel = WorkflowPanel.Write(_folder.Path);

        var plan = RunSnakemake(WriteConfig(panel, Path.Combine(_folder.Path, "merged"), ["--trees", "50", "--threads", "8"]),
            deadline, "--cores", "1", "--dry-run");
        Assert.False(plan.Succeeded, plan.Output);
        Assert.Contains("screen_args must not hold --threads", plan.Output);
    }

    private ChildProcess.Outcome RunSnakemake(string configFile, DateTime deadline, params string[] options) =>
        ChildProcess.Run(SnakemakeTool.Executable!,
            ["--snakefile", RepositoryFolder.Workflows("snakemake", "Snakefile"), "--configfile", configFile,
             "--directory", _folder.Path, .. options],
            _folder.Path, deadline,
            // Snakemake keeps its caches under the home folder; keep them inside the test's folder.
            new Dictionary<string, string> { ["HOME"] = _folder.Path, ["XDG_CACHE_HOME"] = Path.Combine(_folder.Path, ".cache") });

    /// <summary>The workflow's configuration as JSON (which YAML reads), every path absolute.</summary>
    private string WriteConfig(WorkflowPanel panel, string results, string[]? screenArguments = null)
    {
        var config = new Dictionary<string, object>
        {
            ["omicsscreen"] = new[] { "dotnet", ToolAssembly },
            ["matrix"] = panel.Matrix,
            ["samples"] = panel.SampleSheet,
            ["outcome"] = WorkflowPanel.OutcomeColumn,
            ["cohort"] = WorkflowPanel.CohortColumn,
            ["screen_args"] = screenArguments ?? QuickSettings,
            ["parts"] = PartCount,
            ["results"] = results,
            ["threads_per_part"] = 1,
            ["merge_threads"] = 2,
        };
        return _folder.File("config.json", JsonSerializer.Serialize(config));
    }

    /// <summary>Every table and the locked panel, relative to the results folder, in ordinal order.</summary>
    private static List<string> ComparedFiles(string results)
    {
        var files = new List<string>();
        foreach (var path in Directory.EnumerateFiles(results, "*", SearchOption.AllDirectories))
        {
            string relative = Path.GetRelativePath(results, path);
            if (relative.EndsWith(".tsv", StringComparison.Ordinal) || Path.GetFileName(relative) == "locked_panel.json")
                files.Add(relative);
        }
        files.Sort(StringComparer.Ordinal);
        return files;
    }

    /// <summary>The jobs' own logs, for the failure message.</summary>
    private static string LogsOf(string results)
    {
        string logs = results + ".logs";
        if (!Directory.Exists(logs)) return "";
        var text = new System.Text.StringBuilder();
        foreach (var log in Directory.EnumerateFiles(logs))
            text.Append("\n--- ").Append(Path.GetFileName(log)).Append('\n').Append(File.ReadAllText(log));
        return text.ToString();
    }
}
