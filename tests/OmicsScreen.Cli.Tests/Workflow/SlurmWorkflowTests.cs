using OmicsScreen.TestSupport.ExternalTools;
namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>
/// The Slurm examples run through a real single-node Slurm that workflows/slurm/ci_single_node.sh
/// starts on this machine. Only on CI (CI=true), which runs as root; elsewhere they are reported
/// skipped, because they install and start system daemons.
/// </summary>
/// <remarks>Both tests sit in one class so xunit never runs them at once (they use the same ports).</remarks>
public sealed class SlurmWorkflowTests : IDisposable
{
    private static readonly TimeSpan TimeBound = TimeSpan.FromMinutes(5);

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [RequiresToolFact(ExternalTool.Slurm)]
    public void The_slurm_job_array_and_its_merge_job_reproduce_the_tables_of_a_single_screen()
    {
        var deadline = DateTime.UtcNow + TimeBound;
        var baseline = SingleScreenBaseline.Create(_folder.Path, deadline);

        string merged = Path.Combine(_folder.Path, "merged");
        var run = ChildProcess.Run("bash",
            [RepositoryFolder.Workflows("slurm", "ci_single_node.sh"), "--parts", "4", "--cpus", "1", "--merge-cpus", "2", "--mem", "1G",
             "--out", merged, "--", .. OmicsScreenProgram.InputArguments(baseline.Panel), .. OmicsScreenProgram.QuickSettings],
            _folder.Path, deadline, new Dictionary<string, string> { ["OMICSSCREEN"] = OmicsScreenProgram.AssemblyPath });
        Assert.True(run.Succeeded, run.Output + MergedResults.LogsIn(merged + ".logs"));

        MergedResults.AssertSameAsSingleScreen(baseline.Results, merged, 4);
    }

    [RequiresToolFact(ExternalTool.Slurm, ExternalTool.Snakemake)]
    public void Snakemake_with_the_slurm_profile_runs_the_unchanged_workflow_through_slurm()
    {
        ExternalTools.Require(ExternalTool.Snakemake);
        var deadline = DateTime.UtcNow + TimeBound;
        var baseline = SingleScreenBaseline.Create(_folder.Path, deadline);

        var workflow = new SnakemakeWorkflow(_folder.Path);
        string merged = Path.Combine(_folder.Path, "merged");
        string[] snakemake = workflow.Arguments(workflow.WriteConfig(baseline.Panel, merged),
            "--profile", RepositoryFolder.Workflows("snakemake", "profiles", "slurm"));
        var run = ChildProcess.Run("bash",
            [RepositoryFolder.Workflows("slurm", "ci_single_node.sh"), "--run", ExternalTools.SnakemakeExecutable!, .. snakemake],
            _folder.Path, deadline, workflow.Environment);
        Assert.True(run.Succeeded, run.Output + MergedResults.LogsIn(merged + ".logs"));

        MergedResults.AssertSameAsSingleScreen(baseline.Results, merged, SnakemakeWorkflow.PartCount);
        // Each job went through sbatch: the profile's cluster line names Slurm's output file after the rule and job id.
        Assert.Equal(SnakemakeWorkflow.PartCount + 1, Directory.GetFiles(Path.Combine(_folder.Path, "logs", "slurm"), "*.out").Length);
    }
}
