namespace OmicsScreen.Cli.Tests.Commands;

public sealed class DemoCommandTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Demo_writes_the_panel_and_runs_the_main_job_into_the_report_folder()
    {
        string panels = Path.Combine(_folder.Path, "panels");
        string reports = Path.Combine(_folder.Path, "reports");
        var run = CliHarness.Run("demo", "--panel-dir", panels, "--out", reports);

        Assert.Equal(ExitCode.Success, run.ExitCode);
        Assert.True(File.Exists(Path.Combine(panels, "marrowfen_plasma.csv")));
        Assert.True(File.Exists(Path.Combine(panels, "marrowfen_truth.tsv")));
        Assert.True(File.Exists(Path.Combine(reports, "forest_importance.tsv")));
        Assert.Contains("can be screened", run.Out);
    }
}
