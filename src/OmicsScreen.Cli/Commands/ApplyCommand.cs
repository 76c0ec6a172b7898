using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `omicsscreen apply MODEL PANEL`: scores a new cohort with a locked panel and, when its outcome
/// is known, measures how well the panel does on it.
/// </summary>
public sealed class ApplyCommand : Command
{
    public Argument<string> Model { get; } = new("MODEL")
    {
        Description = "The locked panel: locked_panel.json from a screen's results folder.",
    };

    public Argument<string> Panel { get; } = new("PANEL")
    {
        Description = "The new cohort's measurement matrix: CSV, TSV, Parquet or Arrow IPC. Markers are matched by name.",
    };

    public Option<string?> SampleSheet { get; } = new("--samples")
    {
        Description = "Sample sheet (CSV/TSV) joined to the matrix on sample id; holds the outcome.",
        HelpName = "SHEET",
    };

    public Option<string?> Outcome { get; } = new("--outcome")
    {
        Description = "Column holding each sample's known class. Without it samples are scored only, not evaluated.",
        HelpName = "COLUMN",
    };

    public Option<string?> SampleIdColumn { get; } = new("--id-column")
    {
        Description = "Sample id column of the matrix and the sample sheet. Default: the first column.",
        HelpName = "COLUMN",
    };

    public Option<string[]> Annotations { get; } = new("--annotation")
    {
        Description = "Another text column of the matrix file that describes samples rather than measuring them (repeatable).",
        HelpName = "COLUMN",
        AllowMultipleArgumentsPerToken = false,
    };

    public Option<bool> FeaturesInRows { get; } = new("--features-in-rows")
    {
        Description = "The matrix has one feature per row and one sample per column.",
    };

    public Option<bool> DropUnmatched { get; } = new("--drop-unmatched")
    {
        Description = "Drop samples found in only one of matrix and sample sheet (with a warning) instead of stopping.",
    };

    public Option<string> Out { get; } = new("--out")
    {
        Description = "Folder for scores.tsv, the evaluation tables and apply_report.html.",
        HelpName = "DIR",
        Required = true,
    };

    public Option<bool> Force { get; } = new("--force")
    {
        Description = "Write into a folder that is not empty and holds no earlier results.",
    };

    public Option<bool> ShowSampleIds { get; } = new("--show-sample-ids")
    {
        Description = "List every sample's score with its id in the HTML report (scores.tsv always has them).",
    };

    public ApplyCommand(CliConsole console)
        : base("apply", "Score a new cohort with a locked panel; with a known outcome, report AUC, error and calibration.")
    {
        Arguments.Add(Model);
        Arguments.Add(Panel);
        Options.Add(SampleSheet);
        Options.Add(Outcome);
        Options.Add(SampleIdColumn);
        Options.Add(Annotations);
        Options.Add(FeaturesInRows);
        Options.Add(DropUnmatched);
        Options.Add(Out);
        Options.Add(Force);
        Options.Add(ShowSampleIds);
        SetAction(parse => CommandRunner.Run(console, () => ApplyRun.Execute(console, new ApplyRunOptions
        {
            ModelPath = parse.GetValue(Model)!,
            MatrixPath = parse.GetValue(Panel)!,
            SampleSheetPath = parse.GetValue(SampleSheet),
            OutcomeColumn = parse.GetValue(Outcome),
            SampleIdColumn = parse.GetValue(SampleIdColumn),
            AnnotationColumns = parse.GetValue(Annotations) ?? [],
            Layout = parse.GetValue(FeaturesInRows) ? PanelLayout.FeaturesInRows : PanelLayout.SamplesInRows,
            DropUnmatchedSamples = parse.GetValue(DropUnmatched),
            OutputFolder = parse.GetValue(Out)!,
            Force = parse.GetValue(Force),
            ShowSampleIds = parse.GetValue(ShowSampleIds),
            CommandLine = ["omicsscreen", .. parse.Tokens.Select(t => t.Value)],
        })));
    }
}
