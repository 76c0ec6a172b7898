namespace OmicsScreen.Cli.Tests.Commands;

public class HelpTests
{
    [Theory]
    [InlineData("check")]
    [InlineData("grow")]
    [InlineData("demo")]
    public void Every_verb_has_help(string verb)
    {
        var run = CliHarness.Run(verb, "--help");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        Assert.Contains("Usage:", run.Out);
    }

    [Fact]
    public void The_root_help_lists_the_verbs_and_the_caution()
    {
        var run = CliHarness.Run("--help");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        foreach (var verb in new[] { "check", "grow", "demo" }) Assert.Contains(verb, run.Out);
        Assert.Contains("not a diagnostic test", run.Out);
    }
}
