using System.CommandLine;
using System.CommandLine.Help;
using System.CommandLine.Invocation;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;

namespace OmicsScreen.Cli;

/// <summary>Builds the root command with one sub-command per verb and runs it.</summary>
public static class CommandLine
{
    public static RootCommand BuildRoot(CliConsole console)
    {
        var root = new OmicsScreenRootCommand(
            "OmicsScreen: rank the markers of a discovery omics panel with repeated random forests, "
            + "and shortlist the few worth a validation study. Research use only; a screen is not a diagnostic test.");
        root.Subcommands.Add(new CheckCommand(console));
        root.Subcommands.Add(new ScreenCommand(console));
        root.Subcommands.Add(new MergeCommand(console));
        root.Subcommands.Add(new GrowCommand(console));
        root.Subcommands.Add(new ApplyCommand(console));
        root.Subcommands.Add(new DemoCommand(console));
        foreach (var help in root.Options.OfType<HelpOption>())
        {
            help.Description = "Show this help: the options in sections, with examples.";
            help.Action = new SectionedHelpAction(console.Out);
        }
        return root;
    }

    public static int Run(string[] args) => Run(args, CliConsole.FromProcess());

    public static int Run(string[] args, CliConsole console)
    {
        System.Globalization.CultureInfo.DefaultThreadCurrentCulture = System.Globalization.CultureInfo.InvariantCulture;
        System.Globalization.CultureInfo.CurrentCulture = System.Globalization.CultureInfo.InvariantCulture;
        var parse = BuildRoot(console).Parse(args);
        // The parser's own error display appends the whole help; one line per problem is easier to act on.
        if (parse.Action is ParseErrorAction) return UsageErrors.Print(parse, console);
        return parse.Invoke(new InvocationConfiguration { Output = console.Out, Error = console.Error });
    }
}
