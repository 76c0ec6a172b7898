using System.Globalization;
using OmicsScreen.TestSupport.ExternalTools;

namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>
/// The shipped Snakemake workflow (workflows/snakemake) run for real: the parts it runs as separate
/// jobs merge into exactly the results a single screen writes.
/// </summary>
public sealed class WorkflowTests : IDisposable
{
    private static readonly TimeSpan TimeBound = TimeSpan.FromMinutes(5);

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [RequiresToolFact(ExternalTool.Snakemake)]
    public void Four_parts_run_by_snakemake_merge_into_the_tables_of_a_single_screen()
    {
        ExternalTools.Require(ExternalTool.Snakemake);
        var deadline = DateTime.UtcNow + TimeBound;
        var baseline = SingleScreenBaseline.Create(_folder.Path, deadline);

        var workflow = new SnakemakeWorkflow(_folder.Path);
        string merged = Path.Combine(_folder.Path, "merged");
        var run = workflow.Run(workflow.WriteConfig(baseline.Panel, merged), deadline, "--cores", "2");
        Assert.True(run.Succeeded, run.Output + MergedResults.LogsIn(merged + ".logs"));

        MergedResults.AssertSameAsSingleScreen(baseline.Results, merged, SnakemakeWorkflow.PartCount);
        for (int part = 1; part <= SnakemakeWorkflow.PartCount; part++)
        {
            string name = string.Create(CultureInfo.InvariantCulture, $"{part}-of-{SnakemakeWorkflow.PartCount}");
            Assert.True(File.Exists(Path.Combine(merged + ".parts", name, "part.json")), "part folder " + name);
            Assert.True(File.Exists(Path.Combine(merged + ".logs", $"part-{name}.log")), "log of part " + name);
        }
        Assert.True(File.Exists(Path.Combine(merged + ".logs", "merge.log")), "log of the merge");
    }

    [RequiresToolFact(ExternalTool.Snakemake)]
    public void The_slurm_profile_plans_one_job_per_part_and_one_merge_without_changing_the_workflow()
    {
        ExternalTools.Require(ExternalTool.Snakemake);
        var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(2);
        var workflow = new SnakemakeWorkflow(_folder.Path);
        string config = workflow.WriteConfig(WorkflowPanel.Write(_folder.Path), Path.Combine(_folder.Path, "merged"));

        // A dry run submits nothing: it proves Snakemake 7 accepts the profile and plans the jobs.
        var plan = workflow.Run(config, deadline, "--profile", RepositoryFolder.Workflows("snakemake", "profiles", "slurm"), "--dry-run");
        Assert.True(plan.Succeeded, plan.Output);
        Assert.Matches(string.Create(CultureInfo.InvariantCulture, $@"screen_part\s+{SnakemakeWorkflow.PartCount}\s"), plan.Output);
        Assert.Matches(@"merge_parts\s+1\s", plan.Output);
    }

    [RequiresToolFact(ExternalTool.Snakemake)]
    public void The_workflow_refuses_screen_arguments_that_each_job_must_set_itself()
    {
        ExternalTools.Require(ExternalTool.Snakemake);
        var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(2);
        var workflow = new SnakemakeWorkflow(_folder.Path);
        string config = workflow.WriteConfig(WorkflowPanel.Write(_folder.Path), Path.Combine(_folder.Path, "merged"),
            ["--trees", "50", "--threads", "8"]);

        var plan = workflow.Run(config, deadline, "--cores", "1", "--dry-run");
        Assert.False(plan.Succeeded, plan.Output);
        Assert.Contains("screen_args must not hold --threads", plan.Output);
    }
}
