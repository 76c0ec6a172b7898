using System.CommandLine;
using OmicsScreen.Data;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// The options that say where a panel is and which columns mean what; shared by every verb
/// that reads a panel, so they are spelled and validated the same way everywhere.
/// </summary>
public sealed class PanelInputOptions
{
    public Argument<string> Panel { get; } = new("PANEL")
    {
        Description = "The measurement matrix: CSV, TSV, Parquet or Arrow IPC (file or stream).",
    };

    public Option<string?> SampleSheet { get; } = new("--samples")
    {
        Description = "Sample sheet (CSV/TSV) joined to the matrix on sample id; holds the outcome and other sample columns.",
        HelpName = "SHEET",
    };

    public Option<string?> Outcome { get; } = new("--outcome")
    {
        Description = "Column holding each sample's outcome (in the sample sheet, or a text column of the matrix file): "
            + "its class, or a measured quantity. A time to an event is named by --follow-up and --event instead.",
        HelpName = "COLUMN",
    };

    public Option<OutcomeKindChoice> OutcomeKind { get; } = new("--outcome-kind")
    {
        Description = "How --outcome is read: classes, measured (a quantity), or auto: a column of numbers "
            + "with many different values is measured, anything else classes.",
        HelpName = "KIND",
        DefaultValueFactory = _ => OutcomeKindChoice.Auto,
    };

    public Option<string?> FollowUp { get; } = new("--follow-up")
    {
        Description = "Column holding each sample's follow-up time (one unit, not negative) for a time-to-event outcome; use with --event instead of --outcome.",
        HelpName = "COLUMN",
    };

    public Option<string?> Event { get; } = new("--event")
    {
        Description = "Column saying whether the event was observed at the end of follow-up: 1/0, true/false or yes/no (0: censored).",
        HelpName = "COLUMN",
    };

    public Option<string?> Cohort { get; } = new("--cohort")
    {
        Description = "Column naming each sample's cohort, recruitment centre or processing batch.",
        HelpName = "COLUMN",
    };

    public Option<string?> Covariates { get; } = new("--covariates")
    {
        Description = "Comma-separated sample-sheet columns holding clinical covariates (such as age,sex,bmi): numeric when every value "
            + "is a number, categorical otherwise. The screen reports what the panel adds over them and which markers only track one.",
        HelpName = "COLUMNS",
    };

    public Option<string?> Subject { get; } = new("--subject")
    {
        Description = "Column naming each sample's subject, when replicates or repeat visits share one; they are resampled together.",
        HelpName = "COLUMN",
    };

    public Option<string?> PositiveClass { get; } = new("--positive-class")
    {
        Description = "The class scored as positive (AUC, direction of effect). Default: the smallest class.",
        HelpName = "LABEL",
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

    public Option<bool> Long { get; } = new("--long")
    {
        Description = "The matrix is a long table: one row per sample and feature, with sample, feature and value columns "
            + "(named by --id-column, --feature-columns and --value-column; defaults sample, feature, value).",
    };

    public Option<string?> ValueColumn { get; } = new("--value-column")
    {
        Description = "The value column of a long table. Default: value.",
        HelpName = "COLUMN",
    };

    public Option<string?> BelowDetectionFlag { get; } = new("--below-detection-flag")
    {
        Description = "A long table's per-row flag column: a set flag (1, true, yes, flag, below) makes the cell below detection.",
        HelpName = "COLUMN",
    };

    public Option<string?> QualityFlag { get; } = new("--quality-flag")
    {
        Description = "A long table's per-row quality flag column: a set flag (1, true, yes, warn, fail) makes the cell missing.",
        HelpName = "COLUMN",
    };

    public Option<string?> FeatureSheet { get; } = new("--feature-sheet")
    {
        Description = "Feature sheet (CSV/TSV) joined to the matrix on feature id (its first column): display names, annotation columns "
            + "and optional per-feature detection limits (values below a feature's limit become below-detection cells).",
        HelpName = "SHEET",
    };

    public Option<string?> DetectionLimit { get; } = new("--detection-limit")
    {
        Description = "Column holding detection limits: per feature in the feature sheet, per row in a long table. Default: a column named detection_limit.",
        HelpName = "COLUMN",
    };

    public Option<string[]> FeatureColumns { get; } = new("--feature-columns")
    {
        Description = "A column of a features-in-rows (or long) file that describes features rather than measuring a sample (repeatable): "
            + "the first names each feature, the others travel with it as annotations. Default with --features-in-rows: the first column "
            + "and the text columns after it, up to the first column of numbers.",
        HelpName = "COLUMN",
        AllowMultipleArgumentsPerToken = false,
    };

    public Option<string?> DisplayName { get; } = new("--display-name")
    {
        Description = "The describing column (of the feature sheet or the matrix file) holding each feature's lab-facing name, "
            + "shown first in the report and tables. Default: a feature-sheet column named display_name.",
        HelpName = "COLUMN",
    };

    public Option<bool> DropUnmatched { get; } = new("--drop-unmatched")
    {
        Description = "Drop samples found in only one of matrix and sample sheet (with a warning) instead of stopping.",
    };

    public Option<string?> FeatureBlock { get; } = new("--feature-block")
    {
        HelpName = "I/N",
        Description = "Read only block I of N equal blocks of the feature columns (samples in rows): for panels too wide for one machine's memory, screened a block at a time.",
    };

    public Option<string?> KeepFeatures { get; } = new("--keep-features")
    {
        HelpName = "FILE",
        Description = "Read only the features named in FILE (one name per line; # starts a comment), for example the candidates of every block's screen.",
    };

    /// <param name="withCovariates">True for the verbs that use covariates (check, screen); the others do not offer --covariates.</param>
    public void AddTo(Command command, bool withCovariates = false)
    {
        command.Arguments.Add(Panel);
        command.Options.Add(SampleSheet);
        command.Options.Add(Outcome);
        command.Options.Add(OutcomeKind);
        command.Options.Add(FollowUp);
        command.Options.Add(Event);
        command.Options.Add(Cohort);
        if (withCovariates) command.Options.Add(Covariates);
        command.Options.Add(Subject);
        command.Options.Add(PositiveClass);
        command.Options.Add(SampleIdColumn);
        command.Options.Add(Annotations);
        command.Options.Add(FeaturesInRows);
        command.Options.Add(Long);
        command.Options.Add(ValueColumn);
        command.Options.Add(BelowDetectionFlag);
        command.Options.Add(QualityFlag);
        command.Options.Add(FeatureSheet);
        command.Options.Add(DetectionLimit);
        command.Options.Add(FeatureColumns);
        command.Options.Add(DisplayName);
        command.Options.Add(DropUnmatched);
        command.Options.Add(FeatureBlock);
        command.Options.Add(KeepFeatures);
    }

    public PanelLoadOptions ToLoadOptions(ParseResult parse) => new()
    {
        MatrixPath = parse.GetValue(Panel)!,
        SampleSheetPath = parse.GetValue(SampleSheet),
        OutcomeColumn = OutcomeColumnOf(parse),
        OutcomeKind = parse.GetValue(OutcomeKind),
        FollowUpColumn = parse.GetValue(FollowUp),
        EventColumn = parse.GetValue(Event),
        CohortColumn = parse.GetValue(Cohort),
        CovariateColumns = CovariatesOf(parse),
        SubjectColumn = parse.GetValue(Subject),
        PositiveClass = parse.GetValue(PositiveClass),
        SampleIdColumn = parse.GetValue(SampleIdColumn),
        AnnotationColumns = parse.GetValue(Annotations) ?? [],
        Layout = LayoutOf(parse),
        DropUnmatchedSamples = parse.GetValue(DropUnmatched),
        FeatureColumns = parse.GetValue(FeatureColumns) is { Length: > 0 } describing ? describing : null,
        DisplayNameColumn = parse.GetValue(DisplayName),
        FeatureSheetPath = parse.GetValue(FeatureSheet),
        ValueColumn = parse.GetValue(ValueColumn),
        BelowDetectionFlagColumn = parse.GetValue(BelowDetectionFlag),
        QualityFlagColumn = parse.GetValue(QualityFlag),
        DetectionLimitColumn = parse.GetValue(DetectionLimit),
        FeatureBlock = parse.GetValue(FeatureBlock) is { } block ? ParseBlock(block) : null,
        KeepFeatures = parse.GetValue(KeepFeatures) is { } list ? ReadFeatureList(list) : null,
    };

    /// <summary>
    /// The outcome is named one way: --outcome, or --follow-up with --event; anything else is a
    /// usage error that says which option to add or drop.
    /// </summary>
    private string? OutcomeColumnOf(ParseResult parse)
    {
        string? outcome = parse.GetValue(Outcome), followUp = parse.GetValue(FollowUp), eventColumn = parse.GetValue(Event);
        if (followUp is not null || eventColumn is not null)
        {
            if (outcome is not null)
                throw new CommandInputException("--outcome and --follow-up/--event name two different outcomes; give --outcome for classes or a measured quantity, or --follow-up and --event for a time to an event.");
            if (followUp is null || eventColumn is null)
                throw new CommandInputException($"a time-to-event outcome needs both columns: add {(followUp is null ? "--follow-up COLUMN (the follow-up time)" : "--event COLUMN (1 event observed, 0 censored)")}.");
            if (parse.GetResult(OutcomeKind) is { Implicit: false })
                throw new CommandInputException("--outcome-kind says how --outcome is read; leave it out with --follow-up and --event.");
            return null;
        }
        return outcome ?? throw new CommandInputException("name the outcome: --outcome COLUMN (classes or a measured quantity), or --follow-up COLUMN and --event COLUMN (a time to an event).");
    }

    /// <summary>
    /// The covariate columns of --covariates, in order. Each must be named once, and none may be a
    /// column that already has a role (outcome, follow-up, event, cohort, subject): a covariate is
    /// what the panel is compared against, so it cannot also be what is predicted or grouped by.
    /// </summary>
    private IReadOnlyList<string> CovariatesOf(ParseResult parse)
    {
        // Verbs without covariates never declare the option.
        if (parse.GetResult(Covariates) is null || parse.GetValue(Covariates) is not { } text) return [];
        var names = new List<string>();
        foreach (var part in text.Split(','))
        {
            string name = part.Trim();
            if (name.Length == 0)
                throw new CommandInputException($"--covariates '{UntrustedText.Printable(text)}' has an empty column name; list the columns separated by commas, such as --covariates age,sex,bmi.");
            if (names.Contains(name, StringComparer.Ordinal))
                throw new CommandInputException($"--covariates names the column '{UntrustedText.Printable(name)}' twice; name each covariate once.");
            names.Add(name);
        }
        var roles = new (string Option, string? Column)[]
        {
            ("--outcome", parse.GetValue(Outcome)), ("--follow-up", parse.GetValue(FollowUp)), ("--event", parse.GetValue(Event)),
            ("--cohort", parse.GetValue(Cohort)), ("--subject", parse.GetValue(Subject)),
        };
        foreach (var (option, column) in roles)
            if (column is not null && names.Contains(column, StringComparer.Ordinal))
                throw new CommandInputException($"the column '{UntrustedText.Printable(column)}' is named both by {option} and by --covariates; a covariate is what the panel is compared against, so leave it out of one of them.");
        return names;
    }

    /// <summary>The layout the options say; --features-in-rows and --long together are a usage error.</summary>
    public PanelLayout LayoutOf(ParseResult parse)
    {
        bool featuresInRows = parse.GetValue(FeaturesInRows), isLong = parse.GetValue(Long);
        if (featuresInRows && isLong)
            throw new CommandInputException("--features-in-rows and --long describe two different layouts; give the one the matrix has.");
        if (!isLong && (parse.GetValue(ValueColumn) ?? parse.GetValue(BelowDetectionFlag) ?? parse.GetValue(QualityFlag)) is not null)
            throw new CommandInputException("--value-column, --below-detection-flag and --quality-flag name columns of a long table; add --long, or leave them out.");
        return isLong ? PanelLayout.Long : featuresInRows ? PanelLayout.FeaturesInRows : PanelLayout.SamplesInRows;
    }

    private static FeatureBlock ParseBlock(string text)
    {
        var (index, count) = IndexOfCount.Parse(text, "--feature-block", "2/8");
        return new FeatureBlock(index, count);
    }

    /// <summary>One feature name per line, surrounding spaces trimmed; blank lines and lines starting with # are skipped.</summary>
    private static IReadOnlyList<string> ReadFeatureList(string path)
    {
        if (!File.Exists(path))
            throw new CommandInputException($"{path}: the feature list given to --keep-features does not exist.", ExitCode.InputError);
        var names = File.ReadLines(path).Select(line => line.Trim()).Where(line => line.Length > 0 && !line.StartsWith('#')).ToList();
        if (names.Count == 0)
            throw new CommandInputException($"{path}: the feature list given to --keep-features names no feature.", ExitCode.InputError);
        return names;
    }
}
