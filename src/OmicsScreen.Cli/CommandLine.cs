using System.CommandLine;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;

namespace OmicsScreen.Cli;

/// <summary>Builds the root command with one sub-command per verb and runs it.</summary>
public static class CommandLine
{
    public static RootCommand BuildRoot(CliConsole console)
    {
        var root = new RootCommand(
            "OmicsScreen: rank the markers of a discovery omics panel with repeated random forests, "
            + "and shortlist the few worth a validation study. Research use only; a screen is not a diagnostic test.");
        root.Subcommands.Add(new CheckCommand(console));
        root.Subcommands.Add(new ScreenCommand(console));
        root.Subcommands.Add(new MergeCommand(console));
        root.Subcommands.Add(new GrowCommand(console));
        root.Subcommands.Add(new ApplyCommand(console));
        root.Subcommands.Add(new DemoCommand(console));
        return root;
    }

    public static int Run(string[] args) => Run(args, CliConsole.FromProcess());

    public static int Run(string[] args, CliConsole console)
    {
        System.Globalization.CultureInfo.DefaultThreadCurrentCulture = System.Globalization.CultureInfo.InvariantCulture;
        System.Globalization.CultureInfo.CurrentCulture = System.Globalization.CultureInfo.InvariantCulture;
        var parse = BuildRoot(console).Parse(args);
        return parse.Invoke(new InvocationConfiguration { Output = console.Out, Error = console.Error });
    }
}
