using System.Text.Json;
using OmicsScreen.TestSupport.ExternalTools;

namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>The shipped workflows/snakemake/Snakefile, configured for the small test panel and run in one folder.</summary>
internal sealed class SnakemakeWorkflow(string workFolder)
{
    public const int PartCount = 4;

    /// <summary>Snakemake keeps caches under the home folder; keep them inside the test's folder.</summary>
    public IReadOnlyDictionary<string, string> Environment { get; } = new Dictionary<string, string>
    {
        ["HOME"] = workFolder,
        ["XDG_CACHE_HOME"] = Path.Combine(workFolder, ".cache"),
    };

    /// <summary>Writes the workflow's configuration as JSON (which YAML reads), every path absolute; returns its path.</summary>
    public string WriteConfig(WorkflowPanel panel, string results, string[]? screenArguments = null)
    {
        var config = new Dictionary<string, object>
        {
            ["omicsscreen"] = new[] { "dotnet", OmicsScreenProgram.AssemblyPath },
            ["matrix"] = panel.Matrix,
            ["samples"] = panel.SampleSheet,
            ["outcome"] = WorkflowPanel.OutcomeColumn,
            ["cohort"] = WorkflowPanel.CohortColumn,
            ["screen_args"] = screenArguments ?? OmicsScreenProgram.QuickSettings,
            ["parts"] = PartCount,
            ["results"] = results,
            ["threads_per_part"] = 1,
            ["merge_threads"] = 2,
            ["mem_mb_per_part"] = 1000,
            ["mem_mb_merge"] = 1000,
        };
        string path = Path.Combine(workFolder, "config.json");
        File.WriteAllText(path, JsonSerializer.Serialize(config));
        return path;
    }

    /// <summary>The snakemake command line (without the program) for this configuration plus <paramref name="options"/>.</summary>
    public string[] Arguments(string configFile, params string[] options) =>
        ["--snakefile", RepositoryFolder.Workflows("snakemake", "Snakefile"), "--configfile", configFile, "--directory", workFolder, .. options];

    public ChildProcess.Outcome Run(string configFile, DateTime deadline, params string[] options) =>
        ChildProcess.Run(ExternalTools.SnakemakeExecutable!, Arguments(configFile, options), workFolder, deadline, Environment);
}
