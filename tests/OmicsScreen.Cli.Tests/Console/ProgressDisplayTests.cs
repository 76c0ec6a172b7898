using OmicsScreen.Cli.Console;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Tests.Console;

/// <summary>
/// Issue 14: every stage's bar reaches 100% once the screen has moved past it (the screen reports
/// the start of binning, univariate statistics and the reference forest, not their end), and the
/// run's elapsed time is shown.
/// </summary>
public sealed class ProgressDisplayTests
{
    private static void Feed(ProgressDisplay display)
    {
        display.Report(new ScreenProgress(ScreenStage.Binning, 0, 1));
        display.Report(new ScreenProgress(ScreenStage.UnivariateStatistics, 0, 1));
        display.Report(new ScreenProgress(ScreenStage.ReferenceForest, 0, 1));
        for (int done = 0; done <= 4; done++) display.Report(new ScreenProgress(ScreenStage.Repeats, done, 4));
        display.Report(new ScreenProgress(ScreenStage.PanelSizeCurve, 0, 5));
        display.Report(new ScreenProgress(ScreenStage.PanelSizeCurve, 2, 5));
        display.Finish();
        display.Complete();
    }

    [Fact]
    public void On_a_terminal_every_bar_ends_full_with_the_run_time()
    {
        var error = new StringWriter();
        Feed(new ProgressDisplay(new CliConsole(TextWriter.Null, error, isTerminal: true), quiet: false));
        var bars = error.ToString().Split('\n');
        foreach (var stage in new[] { "binning", "univariate statistics", "reference forest", "half-sample repeats", "panel-size curve" })
        {
            string line = bars.Single(l => l.Contains(stage, StringComparison.Ordinal));
            string last = line.Split('\r', StringSplitOptions.RemoveEmptyEntries)[^1];
            Assert.Contains("100%", last);
            Assert.Contains("elapsed", last);
        }
        Assert.Contains("finished in", error.ToString());
    }

    [Fact]
    public void In_a_log_every_stage_ends_with_its_full_count()
    {
        var error = new StringWriter();
        Feed(new ProgressDisplay(new CliConsole(TextWriter.Null, error, isTerminal: false), quiet: false));
        string log = error.ToString();
        Assert.Contains("binning: 1/1", log);
        Assert.Contains("univariate statistics: 1/1", log);
        Assert.Contains("reference forest: 1/1", log);
        Assert.Contains("half-sample repeats: 4/4", log);
        Assert.Contains("panel-size curve: 5/5", log);
        Assert.Contains("finished in", log);
        Assert.DoesNotContain("\u001b", log);
    }

    [Fact]
    public void Quiet_shows_nothing()
    {
        var error = new StringWriter();
        Feed(new ProgressDisplay(new CliConsole(TextWriter.Null, error, isTerminal: true), quiet: true));
        Assert.Equal("", error.ToString());
    }
}
