using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;
using OmicsScreen.Data.Demo;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `omicsscreen demo`: writes the invented demo study and runs the main job on it, so a new
/// user sees the whole tool work on a fresh machine with one command.
/// </summary>
public sealed class DemoCommand : Command, IHelpLayout
{
    public Option<string> PanelFolder { get; } = new("--panel-dir")
    {
        Description = "Folder for the generated demo panel.",
        HelpName = "DIR",
        DefaultValueFactory = _ => Path.Combine("panels", "demo"),
    };

    public Option<string> ReportFolder { get; } = CommonOptions.Out("Folder for the demo's results and report.", Path.Combine("reports", "demo"));

    public Option<ulong> Seed { get; } = CommonOptions.Seed("Seed of the simulated study (the same seed gives byte-identical files).", new DemoStudyOptions().Seed);

    public Option<bool> PanelOnly { get; } = new("--panel-only")
    {
        Description = "Only write the demo panel; do not run the screen on it.",
    };

    public Option<bool> Quiet { get; } = CommonOptions.Quiet();

    public IReadOnlyList<HelpSection> HelpSections => [new("Run", [PanelFolder, ReportFolder, Seed, PanelOnly, Quiet])];

    public IReadOnlyList<HelpExample> Examples =>
    [
        new("Write the invented Marrowfen study to panels/demo and screen it into reports/demo", "omicsscreen demo"),
        new("Only write the demo panel, to try the other commands on it", "omicsscreen demo --panel-only --panel-dir panels/demo"),
    ];

    public DemoCommand(CliConsole console) : base("demo", "Write the invented demo panel and run the main job on it.")
    {
        Options.Add(PanelFolder);
        Options.Add(ReportFolder);
        Options.Add(Seed);
        Options.Add(PanelOnly);
        Options.Add(Quiet);
        SetAction(parse => CommandRunner.Run(console, () => DemoRun.Execute(console, new DemoRunOptions(
            parse.GetValue(PanelFolder)!, parse.GetValue(ReportFolder)!, parse.GetValue(Seed), parse.GetValue(PanelOnly), parse.GetValue(Quiet)))));
    }
}
