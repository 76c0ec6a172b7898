using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;
using OmicsScreen.Data;
using OmicsScreen.Runs.Apply;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `omicsscreen apply MODEL PANEL`: scores a new cohort with a locked panel and, when its outcome
/// is known, measures how well the panel does on it.
/// </summary>
public sealed class ApplyCommand : Command, IHelpLayout
{
    public Argument<string> Model { get; } = new("MODEL")
    {
        Description = "The locked panel: locked_panel.json from a screen's results folder.",
    };

    /// <summary>The panel options every verb spells the same way; apply uses the matrix, sheet, id and layout ones.</summary>
    public PanelInputOptions Input { get; } = new();

    /// <summary>Unlike the screen's, the outcome is optional here: a cohort can be scored before its outcome is known.</summary>
    public Option<string?> Outcome { get; } = new("--outcome")
    {
        Description = "Column holding each sample's known outcome (a class, or a measured value for a panel locked on one). Without it samples are scored only, not evaluated.",
        HelpName = "COLUMN",
    };

    /// <summary>The time-dependent AUC's horizon, for a panel locked on a time to an event.</summary>
    public Option<double?> Horizon { get; } = new("--horizon")
    {
        Description = "For a panel locked on a time to an event: also report the time-dependent AUC at this time (in the follow-up column's unit): "
            + "events by then against samples followed beyond it, with censoring weights.",
        HelpName = "TIME",
    };

    public Option<string> Out { get; } = CommonOptions.RequiredOut("Folder for scores.tsv, the evaluation tables and apply_report.html.");

    public Option<bool> Force { get; } = CommonOptions.Force("Write into a folder that is not empty and holds no earlier results.");

    public Option<bool> ShowSampleIds { get; } = new("--show-sample-ids")
    {
        Description = "List every sample's score with its id in the HTML report (scores.tsv always has them).",
    };

    public Option<bool> Json { get; } = new("--json")
    {
        Description = "Print the headline results (calls per class, AUC, error, warnings, files written) as JSON on standard output instead of the text summary.",
    };

    public IReadOnlyList<HelpSection> HelpSections =>
    [
        new("Input", [Input.SampleSheet, Outcome, Input.FollowUp, Input.Event, Horizon, Input.SampleIdColumn, Input.Annotations, Input.FeaturesInRows, Input.Long, Input.FeatureColumns,
            Input.ValueColumn, Input.DetectionLimit, Input.BelowDetectionFlag, Input.QualityFlag, Input.DropUnmatched]),
        new("Run", [Out, Force, ShowSampleIds, Json]),
    ];

    public IReadOnlyList<HelpExample> Examples =>
    [
        new("Score a validation cohort whose outcome is known: AUC, error and calibration",
            "omicsscreen apply reports/plasma/locked_panel.json validation.csv --samples validation_sheet.tsv --outcome status --out reports/validation"),
        new("A panel locked on a measured outcome: R², RMSE and the calibration line",
            "omicsscreen apply reports/activity/locked_panel.json validation.csv --samples validation_sheet.tsv --outcome activity_score --out reports/activity-validation"),
        new("A panel locked on a time to an event: concordance, the AUC at 24 months and the risk groups' survival",
            "omicsscreen apply reports/flare/locked_panel.json validation.csv --samples validation_sheet.tsv --follow-up months --event flare --horizon 24 --out reports/flare-validation"),
    ];

    public ApplyCommand(CliConsole console)
        : base("apply", "Score a new cohort with a locked panel; with a known outcome, report how well it does (AUC, R² or concordance) and its calibration or risk groups.")
    {
        Arguments.Add(Model);
        Arguments.Add(Input.Panel);
        Options.Add(Input.SampleSheet);
        Options.Add(Outcome);
        Options.Add(Input.FollowUp);
        Options.Add(Input.Event);
        Options.Add(Horizon);
        Options.Add(Input.SampleIdColumn);
        Options.Add(Input.Annotations);
        Options.Add(Input.FeaturesInRows);
        Options.Add(Input.Long);
        Options.Add(Input.FeatureColumns);
        Options.Add(Input.ValueColumn);
        Options.Add(Input.DetectionLimit);
        Options.Add(Input.BelowDetectionFlag);
        Options.Add(Input.QualityFlag);
        Options.Add(Input.DropUnmatched);
        Options.Add(Out);
        Options.Add(Force);
        Options.Add(ShowSampleIds);
        Options.Add(Json);
        SetAction(parse => CommandRunner.Run(console, () => ApplyRun.Execute(console, new ApplyRunOptions
        {
            Request = new ApplyRequest
            {
                ModelPath = parse.GetValue(Model)!,
                MatrixPath = parse.GetValue(Input.Panel)!,
                SampleSheetPath = parse.GetValue(Input.SampleSheet),
                OutcomeColumn = parse.GetValue(Outcome),
                FollowUpColumn = parse.GetValue(Input.FollowUp),
                EventColumn = parse.GetValue(Input.Event),
                Horizon = parse.GetValue(Horizon),
                SampleIdColumn = parse.GetValue(Input.SampleIdColumn),
                AnnotationColumns = parse.GetValue(Input.Annotations) ?? [],
                Layout = Input.LayoutOf(parse),
                FeatureColumns = parse.GetValue(Input.FeatureColumns) is { Length: > 0 } describing ? describing : null,
                ValueColumn = parse.GetValue(Input.ValueColumn),
                DetectionLimitColumn = parse.GetValue(Input.DetectionLimit),
                BelowDetectionFlagColumn = parse.GetValue(Input.BelowDetectionFlag),
                QualityFlagColumn = parse.GetValue(Input.QualityFlag),
                DropUnmatchedSamples = parse.GetValue(Input.DropUnmatched),
                OutputFolder = parse.GetValue(Out)!,
                Force = parse.GetValue(Force),
                ShowSampleIds = parse.GetValue(ShowSampleIds),
                CommandLine = ["omicsscreen", .. parse.Tokens.Select(t => t.Value)],
            },
            Json = parse.GetValue(Json),
        })));
    }
}
