using System.CommandLine;
using OmicsScreen.Cli.Console;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `omicsscreen check`: reads a panel and says what it found and whether it can be screened,
/// before anyone spends an hour of compute on it.
/// </summary>
public sealed class CheckCommand : Command
{
    public PanelInputOptions Input { get; } = new();

    public Option<bool> Json { get; } = new("--json")
    {
        Description = "Print the findings as JSON instead of a table.",
    };

    public CheckCommand(CliConsole console)
        : base("check", "Read a panel and report samples, features, classes, cohorts, missingness, below-detection cells and problems. Exit 0 when it can be screened.")
    {
        Input.AddTo(this);
        Options.Add(Json);
        SetAction(parse => CommandRunner.Run(console, () => CheckRun.Execute(console, Input.ToLoadOptions(parse), parse.GetValue(Json))));
    }
}
