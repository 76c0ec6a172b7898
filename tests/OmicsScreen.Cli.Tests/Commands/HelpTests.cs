using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;
using OmicsScreen.Cli.Tests.Workflow;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// The help of every verb: sections, a value name for every option that takes a value, no
/// sentinel default, examples; and the text itself, compared with the approved copy in
/// tests/OmicsScreen.Cli.Tests/Commands/Approved. To approve a deliberate change, run the tests
/// with OMICSSCREEN_APPROVE_HELP=1 and review the diff of the approved files.
/// </summary>
public class HelpTests
{
    public static TheoryData<string> Verbs => new() { "", "check", "screen", "merge", "grow", "apply", "demo" };

    private static Command CommandOf(string verb)
    {
        var root = CommandLine.BuildRoot(new CliConsole(TextWriter.Null, TextWriter.Null, isTerminal: false));
        return verb.Length == 0 ? root : root.Subcommands.Single(c => c.Name == verb);
    }

    [Theory]
    [MemberData(nameof(Verbs))]
    public void The_help_matches_the_approved_text(string verb)
    {
        var run = verb.Length == 0 ? CliHarness.Run("--help") : CliHarness.Run(verb, "--help");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        string approvedPath = Path.Combine(RepositoryFolder.Root, "tests", "OmicsScreen.Cli.Tests", "Commands", "Approved",
            (verb.Length == 0 ? "omicsscreen" : verb) + ".help.txt");
        if (Environment.GetEnvironmentVariable("OMICSSCREEN_APPROVE_HELP") == "1")
            File.WriteAllText(approvedPath, run.Out);
        Assert.True(File.Exists(approvedPath), $"no approved help at {approvedPath}");
        Assert.Equal(File.ReadAllText(approvedPath).ReplaceLineEndings("\n"), run.Out.ReplaceLineEndings("\n"));
    }

    [Theory]
    [MemberData(nameof(Verbs))]
    public void Every_option_that_takes_a_value_names_it_and_no_line_is_too_wide(string verb)
    {
        var command = CommandOf(verb);
        foreach (var option in command.Options.Where(o => !o.Hidden && HelpText.TakesValue(o)))
            Assert.False(string.IsNullOrEmpty(option.HelpName), $"{option.Name} of `{verb}` has no value name");
        string text = HelpText.For(command);
        foreach (var line in text.Split('\n')) Assert.True(line.Length <= 100 || line.StartsWith("    omicsscreen", StringComparison.Ordinal), line);
        Assert.DoesNotContain("Default: -1", text);
        Assert.DoesNotContain("<", text.Replace("<LOD", "").Replace("<=", ""));
    }

    [Theory]
    [InlineData("check")]
    [InlineData("screen")]
    [InlineData("merge")]
    [InlineData("grow")]
    [InlineData("apply")]
    [InlineData("demo")]
    public void Every_verb_has_examples_and_places_every_option_in_a_section(string verb)
    {
        var command = CommandOf(verb);
        var layout = Assert.IsAssignableFrom<IHelpLayout>(command);
        Assert.InRange(layout.Examples.Count, 2, 3);
        var sections = HelpText.Sections(command);
        Assert.DoesNotContain(sections, s => s.Title == "Other options");
        foreach (var example in layout.Examples) Assert.StartsWith($"omicsscreen {verb}", example.CommandLine);
    }

    [Fact]
    public void The_screen_help_has_the_sections_of_issue_14()
    {
        var run = CliHarness.Run("screen", "--help");
        int last = -1;
        foreach (var title in new[] { "Input:", "Forest:", "Selection and error control:", "Panel-size curve:", "Cohorts:", "Run:", "Examples:" })
        {
            int at = run.Out.IndexOf("\n" + title + "\n", StringComparison.Ordinal);
            Assert.True(at > last, $"section {title} missing or out of order");
            last = at;
        }
    }

    [Fact]
    public void The_root_help_lists_the_verbs_and_the_caution()
    {
        var run = CliHarness.Run("--help");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        foreach (var verb in new[] { "check", "screen", "merge", "grow", "apply", "demo" }) Assert.Contains(verb, run.Out);
        Assert.Contains("not a diagnostic test", run.Out);
    }
}
