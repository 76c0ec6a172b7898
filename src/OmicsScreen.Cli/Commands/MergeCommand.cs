using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;
using OmicsScreen.Cli.Work;

namespace OmicsScreen.Cli.Commands;

/// <summary>`omicsscreen merge`: joins the parts of a split screen into the results folder a single run writes.</summary>
public sealed class MergeCommand : Command, IHelpLayout
{
    public Argument<string[]> Parts { get; } = new("PARTS")
    {
        Description = "The part folders written by `screen --part I/N`, all N of them.",
        Arity = ArgumentArity.OneOrMore,
    };

    public Option<string> Out { get; } = CommonOptions.RequiredOut("Results folder.");

    public Option<bool> Force { get; } = CommonOptions.Force("Write into a non-empty folder that does not hold an earlier screen's results.");

    public Option<int?> Threads { get; } = CommonOptions.Threads("Threads to use for the work a merge does itself. Default: all cores.");

    public Option<bool> Quiet { get; } = CommonOptions.Quiet();

    public IReadOnlyList<HelpSection> HelpSections => [new("Run", [Out, Force, Threads, Quiet])];

    public IReadOnlyList<HelpExample> Examples =>
    [
        new("Join the four parts of a split screen into one results folder",
            "omicsscreen merge parts/1 parts/2 parts/3 parts/4 --out reports/plasma"),
        new("The same on a busy node, with two threads and no progress display",
            "omicsscreen merge parts/* --out reports/plasma --threads 2 --quiet"),
    ];

    public MergeCommand(CliConsole console)
        : base("merge", "Merge the parts of a screen split with `screen --part I/N` into one results folder, the same as a single run's.")
    {
        Arguments.Add(Parts);
        foreach (var option in new Option[] { Out, Force, Threads, Quiet }) Options.Add(option);
        SetAction(parse => CommandRunner.Run(console, () => MergeRun.Execute(console, new MergeRunOptions
        {
            PartFolders = parse.GetValue(Parts) ?? [],
            OutputFolder = parse.GetValue(Out)!,
            Force = parse.GetValue(Force),
            Quiet = parse.GetValue(Quiet),
            ThreadCount = CommonOptions.ThreadCount(parse, Threads),
        })));
    }
}
