using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>`screen --memory-limit`: a run that would not fit is refused before anything is read or written.</summary>
public sealed class MemoryLimitTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static readonly string[] QuickSettings =
        ["--pairs", "2", "--trees", "40", "--curve-folds", "0"];

    private string[] ScreenWdbc(string outFolder, params string[] extra) =>
        ["screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--out", outFolder, .. QuickSettings, .. extra];

    [Fact]
    public void A_limit_below_the_estimate_stops_with_exit_code_5_and_creates_no_folder()
    {
        string results = Path.Combine(_folder.Path, "results");
        var run = CliHarness.Run(ScreenWdbc(results, "--memory-limit", "1M"));

        Assert.Equal(ExitCode.NotEnoughMemory, run.ExitCode);
        Assert.False(Directory.Exists(results));
        Assert.Contains("error: this screen would need about", run.Error);
        Assert.Contains("more than the limit of 1 MB (--memory-limit)", run.Error);
        Assert.Contains("569 samples x 30 features", run.Error);
        Assert.Contains("forest on all samples", run.Error);
        Assert.Contains("--trees 20", run.Error);
        Assert.Contains("--part I/N (split into parts)", run.Error);
        Assert.Contains("fewer features", run.Error);
        Assert.Equal("", run.Out);
    }

    [Fact]
    public void A_generous_limit_runs_the_screen_and_reports_the_estimate()
    {
        string results = Path.Combine(_folder.Path, "results");
        var run = CliHarness.Run(ScreenWdbc(results, "--memory-limit", "64G"));

        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.True(File.Exists(Path.Combine(results, "shortlist.tsv")));
        Assert.Matches(@"memory: about [0-9.]+ MB estimated, limit 64 GB \(--memory-limit\)", run.Error);
    }

    [Fact]
    public void Quiet_runs_print_no_estimate()
    {
        var run = CliHarness.Run(ScreenWdbc(Path.Combine(_folder.Path, "results"), "--memory-limit", "64G", "--quiet"));

        Assert.Equal(ExitCode.Success, run.ExitCode);
        Assert.DoesNotContain("memory:", run.Error);
    }

    [Theory]
    [InlineData("12Q")]
    [InlineData("-1G")]
    [InlineData("lots")]
    public void An_invalid_size_is_a_usage_error_naming_the_option(string size)
    {
        string results = Path.Combine(_folder.Path, "results");
        var run = CliHarness.Run(ScreenWdbc(results, "--memory-limit", size));

        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("--memory-limit", run.Error);
        Assert.Contains("is not a memory size", run.Error);
        Assert.False(Directory.Exists(results));
    }
}
