namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>The tool as a separate program (dotnet omicsscreen.dll), the way workflows and job scripts start it.</summary>
internal static class OmicsScreenProgram
{
    /// <summary>Small settings so each job takes seconds; the single run and every part get the same ones.</summary>
    public static readonly string[] QuickSettings =
        ["--pairs", "4", "--trees", "50", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "5", "--seed", "7", "--quiet"];

    /// <summary>The built tool, copied to the test output folder as a referenced project.</summary>
    public static string AssemblyPath
    {
        get
        {
            string path = Path.Combine(AppContext.BaseDirectory, "omicsscreen.dll");
            Assert.True(File.Exists(path), "omicsscreen.dll is not in the test output folder");
            return path;
        }
    }

    /// <summary>The panel's input options as `screen` takes them: matrix, sample sheet, outcome and cohort.</summary>
    public static string[] InputArguments(WorkflowPanel panel) =>
        [panel.Matrix, "--samples", panel.SampleSheet, "--outcome", WorkflowPanel.OutcomeColumn, "--cohort", WorkflowPanel.CohortColumn];

    /// <summary>Runs one whole `screen` with the quick settings into <paramref name="results"/>; asserts it succeeded.</summary>
    public static void ScreenOnce(WorkflowPanel panel, string results, DateTime deadline)
    {
        var run = ChildProcess.Run("dotnet",
            [AssemblyPath, "screen", .. InputArguments(panel), .. QuickSettings, "--threads", "2", "--out", results],
            Path.GetDirectoryName(results)!, deadline);
        Assert.True(run.Succeeded, run.Output);
    }
}
