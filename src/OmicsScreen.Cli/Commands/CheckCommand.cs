using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `omicsscreen check`: reads a panel and says what it found and whether it can be screened,
/// before anyone spends an hour of compute on it.
/// </summary>
public sealed class CheckCommand : Command, IHelpLayout
{
    public PanelInputOptions Input { get; } = new();

    public Option<bool> Json { get; } = new("--json")
    {
        Description = "Print the findings as JSON instead of a table.",
    };

    public IReadOnlyList<HelpSection> HelpSections =>
    [
        new("Input", [Input.SampleSheet, Input.Outcome, Input.OutcomeKind, Input.FollowUp, Input.Event, Input.PositiveClass, Input.Subject, Input.Covariates, Input.SampleIdColumn, Input.Annotations,
            Input.FeatureSheet, Input.DetectionLimit, Input.FeaturesInRows, Input.Long, Input.FeatureColumns, Input.ValueColumn,
            Input.BelowDetectionFlag, Input.QualityFlag, Input.DisplayName, Input.DropUnmatched, Input.FeatureBlock, Input.KeepFeatures]),
        new("Cohorts", [Input.Cohort]),
        new("Run", [Json]),
    ];

    public IReadOnlyList<HelpExample> Examples =>
    [
        new("Check a matrix whose outcome is a text column of the same file", "omicsscreen check wdbc.csv --outcome diagnosis"),
        new("Check a matrix with its sample sheet, cohort column and clinical covariates",
            "omicsscreen check plasma.csv --samples sheet.tsv --outcome status --cohort centre --covariates age,sex,bmi"),
        new("The findings as JSON, for a pipeline", "omicsscreen check plasma.csv --samples sheet.tsv --outcome status --json"),
    ];

    public CheckCommand(CliConsole console)
        : base("check", "Read a panel and report samples, features, classes, cohorts, missingness, below-detection cells and problems. Exit 0 when it can be screened.")
    {
        Input.AddTo(this, withCovariates: true);
        Options.Add(Json);
        SetAction(parse => CommandRunner.Run(console, () => CheckRun.Execute(console, Input.ToLoadOptions(parse), parse.GetValue(Json))));
    }
}
