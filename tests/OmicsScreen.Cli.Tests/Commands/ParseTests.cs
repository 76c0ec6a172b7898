using System.CommandLine;
using System.Globalization;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// Parse-only tests of every verb (issue 16): every option of every verb takes a value of its
/// type from the command line without running anything, the options several verbs share are one
/// declaration (CommonOptions) with one type and value name, and a verb without its arguments
/// says once which are missing. The help of every verb is held by <see cref="HelpTests"/>.
/// </summary>
public sealed class ParseTests
{
    private static RootCommand Root() => CommandLine.BuildRoot(new CliConsole(TextWriter.Null, TextWriter.Null, isTerminal: false));

    public static TheoryData<string> Verbs => new() { "check", "screen", "merge", "grow", "apply", "demo" };

    /// <summary>A command line that satisfies the verb: its arguments and its required options.</summary>
    private static List<string> Minimal(Command verb)
    {
        var tokens = new List<string> { verb.Name };
        foreach (var argument in verb.Arguments) tokens.Add(argument.Name.ToLowerInvariant() + ".csv");
        foreach (var option in verb.Options.Where(o => o.Required)) tokens.AddRange([option.Name, Sample(option)]);
        return tokens;
    }

    /// <summary>A legal value for an option, by its type (common practice: one valid value per type).</summary>
    private static string Sample(Option option) => option.Name switch
    {
        "--part" or "--feature-block" => "1/2",
        "--memory-limit" => "8G",
        "--outcome-kind" => "measured",
        _ when option.ValueType == typeof(int) || option.ValueType == typeof(int?) => "3",
        _ when option.ValueType == typeof(double) || option.ValueType == typeof(double?) => "0.25",
        _ when option.ValueType == typeof(ulong) => "9",
        _ when option.ValueType.IsEnum || Nullable.GetUnderlyingType(option.ValueType)?.IsEnum == true => "on",
        _ => "value.tsv",
    };

    [Theory]
    [MemberData(nameof(Verbs))]
    public void Every_option_of_the_verb_parses_a_value_of_its_type(string verbName)
    {
        var root = Root();
        var verb = root.Subcommands.Single(c => c.Name == verbName);
        foreach (var option in verb.Options.Where(o => !o.Hidden && !o.Name.StartsWith("--help", StringComparison.Ordinal) && o.Name != "-?" && o.Name != "-h"))
        {
            var tokens = Minimal(verb);
            if (!option.Required)
            {
                tokens.Add(option.Name);
                if (option.ValueType != typeof(bool)) tokens.Add(Sample(option));
            }
            var parse = root.Parse(tokens);
            Assert.True(parse.Errors.Count == 0, $"{string.Join(' ', tokens)}: {string.Join("; ", parse.Errors.Select(e => e.Message))}");
            var result = parse.GetResult(option);
            Assert.NotNull(result);
            Assert.False(result.Implicit, $"{option.Name} of {verbName} took its default");
            object? value = result.GetValueOrDefault<object?>();
            string expected = option.ValueType == typeof(bool) ? "True" : Sample(option);
            string actual = value switch
            {
                string[] many => string.Join(',', many),
                IFormattable number => number.ToString(null, CultureInfo.InvariantCulture),
                _ => value?.ToString() ?? "",
            };
            if (option.Name == "--memory-limit") Assert.Equal(8L << 30, value);
            else Assert.Equal(expected, actual, ignoreCase: true);
        }
    }

    public static TheoryData<string, string> SharedOptions => new()
    {
        { "screen", "--threads" }, { "merge", "--threads" }, { "grow", "--threads" },
        { "screen", "--quiet" }, { "merge", "--quiet" }, { "demo", "--quiet" },
        { "screen", "--out" }, { "merge", "--out" }, { "apply", "--out" }, { "demo", "--out" },
        { "screen", "--force" }, { "merge", "--force" }, { "apply", "--force" },
        { "screen", "--seed" }, { "grow", "--seed" }, { "demo", "--seed" },
    };

    [Theory]
    [MemberData(nameof(SharedOptions))]
    public void A_shared_option_has_one_type_and_value_name_in_every_verb(string verbName, string optionName)
    {
        var verb = Root().Subcommands.Single(c => c.Name == verbName);
        var option = verb.Options.Single(o => o.Name == optionName);
        var reference = optionName switch
        {
            "--threads" => (Option)CommonOptions.Threads("x"),
            "--quiet" => CommonOptions.Quiet(),
            "--out" => CommonOptions.Out("x"),
            "--force" => CommonOptions.Force("x"),
            _ => CommonOptions.Seed("x", 1),
        };
        // --out is optional in screen, required in apply and merge, defaulted in demo: one value type.
        Assert.Equal(Nullable.GetUnderlyingType(reference.ValueType) ?? reference.ValueType, Nullable.GetUnderlyingType(option.ValueType) ?? option.ValueType);
        Assert.Equal(reference.HelpName, option.HelpName);
        if (optionName == "--quiet") Assert.Equal(CommonOptions.QuietDescription, option.Description);
    }

    [Theory]
    [InlineData("screen")]
    [InlineData("merge")]
    [InlineData("grow")]
    public void Threads_are_read_alike_in_every_verb(string verbName)
    {
        var root = Root();
        var verb = root.Subcommands.Single(c => c.Name == verbName);
        var threads = (Option<int?>)verb.Options.Single(o => o.Name == "--threads");
        Assert.Equal(2, CommonOptions.ThreadCount(root.Parse([.. Minimal(verb), "--threads", "2"]), threads));
        // Left out: 0, which the engine reads as every core.
        Assert.Equal(0, CommonOptions.ThreadCount(root.Parse(Minimal(verb)), threads));
        var refused = Assert.Throws<CommandInputException>(() => CommonOptions.ThreadCount(root.Parse([.. Minimal(verb), "--threads", "0"]), threads));
        Assert.Contains("leave it out to use all cores", refused.Message);
    }

    [Fact]
    public void Apply_without_arguments_names_both_missing_arguments_once()
    {
        var run = CliHarness.Run("apply");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.DoesNotContain("Required argument missing", run.Error);
        Assert.Contains("error: MODEL and PANEL are missing: `omicsscreen apply MODEL PANEL`.", run.Error);
        Assert.Equal(1, run.Error.Split('\n').Count(line => line.Contains("missing", StringComparison.Ordinal)));
        Assert.Contains("error: --out is required.", run.Error);
    }

    [Fact]
    public void A_verb_missing_one_argument_names_it()
    {
        var run = CliHarness.Run("check", "--outcome", "status");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("error: PANEL is missing: `omicsscreen check PANEL`.", run.Error);
    }
}
