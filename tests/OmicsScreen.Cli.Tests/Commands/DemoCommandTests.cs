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
        Assert.True(File.Exists(Path.Combine(reports, "shortlist.tsv")));
        Assert.True(File.Exists(Path.Combine(reports, "manifest.json")));
        Assert.Contains("can be screened", run.Out);
        Assert.Contains("Panel-size curve:", run.Out);
        Assert.Contains("Locked panel:", run.Out);

        // Every planted marker of the demo study is a true marker; the screen must find most of
        // them and nothing that is pure noise (the truth table written beside the panel).
        var truth = File.ReadAllLines(Path.Combine(panels, "marrowfen_truth.tsv")).Skip(1)
            .Select(line => line.Split('\t')).ToDictionary(cells => cells[0], cells => cells[1]);
        var shortlist = File.ReadAllLines(Path.Combine(reports, "shortlist.tsv")).Skip(1).Select(line => line.Split('\t')[1]).ToList();
        int planted = truth.Values.Count(role => role is "marker" or "module_marker" or "censored_marker");
        int found = shortlist.Count(f => truth[f] is "marker" or "module_marker" or "censored_marker");
        Assert.True(found >= 0.8 * planted, $"found {found} of {planted} planted markers");
        Assert.DoesNotContain(shortlist, f => truth[f] == "noise");
    }
}
