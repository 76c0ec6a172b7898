using OmicsScreen.Data;

namespace OmicsScreen.Runs.Apply;

/// <summary>Everything `apply` is asked to do, as plain values: the locked panel, the cohort and how to read it, the results folder.</summary>
public sealed record ApplyRequest
{
    /// <summary>The locked panel file (locked_panel.json of a screen's results folder).</summary>
    public required string ModelPath { get; init; }

    /// <summary>The new cohort's measurement matrix.</summary>
    public required string MatrixPath { get; init; }

    public string? SampleSheetPath { get; init; }

    /// <summary>The outcome column; null when the outcome is not known, which skips the evaluation.</summary>
    public string? OutcomeColumn { get; init; }

    /// <summary>For a panel locked on a time to an event: the follow-up time and event columns (both or neither).</summary>
    public string? FollowUpColumn { get; init; }
    public string? EventColumn { get; init; }

    /// <summary>The time at which to compute the time-dependent AUC (follow-up panels; in the follow-up's unit); null for none.</summary>
    public double? Horizon { get; init; }

    /// <summary>Whether the cohort's outcome (classes, a measured value, or follow-up) is known.</summary>
    public bool OutcomeKnown => OutcomeColumn is not null || FollowUpColumn is not null;

    public string? SampleIdColumn { get; init; }

    public IReadOnlyList<string> AnnotationColumns { get; init; } = [];

    public PanelLayout Layout { get; init; } = PanelLayout.SamplesInRows;

    public bool DropUnmatchedSamples { get; init; }

    /// <summary>For a long table: its feature, value, limit and flag columns (the panel options of the other verbs).</summary>
    public IReadOnlyList<string>? FeatureColumns { get; init; }
    public string? ValueColumn { get; init; }
    public string? DetectionLimitColumn { get; init; }
    public string? BelowDetectionFlagColumn { get; init; }
    public string? QualityFlagColumn { get; init; }

    public required string OutputFolder { get; init; }

    public bool Force { get; init; }

    /// <summary>Show per-sample scores with their ids in the HTML report (they are always in scores.tsv).</summary>
    public bool ShowSampleIds { get; init; }

    /// <summary>The arguments as typed, for the manifest.</summary>
    public IReadOnlyList<string> CommandLine { get; init; } = [];

    /// <exception cref="RunRefusedException">A missing or contradictory option (a usage refusal).</exception>
    public void Validate()
    {
        if (string.IsNullOrWhiteSpace(OutputFolder)) throw new RunRefusedException("Give the results folder with --out.");
        if ((FollowUpColumn is null) != (EventColumn is null))
            throw new RunRefusedException("--follow-up and --event go together: name the follow-up time column and the event column, or neither.");
        if (OutcomeColumn is not null && FollowUpColumn is not null)
            throw new RunRefusedException("--outcome names a class or measured outcome and --follow-up a time to an event; give the one the locked panel was screened on.");
        if (SampleSheetPath is not null && !OutcomeKnown)
            throw new RunRefusedException("A sample sheet was given without --outcome (or --follow-up and --event); name the outcome column, or leave out --samples to score without one.");
        if (Horizon is { } horizon && !(double.IsFinite(horizon) && horizon > 0))
            throw new RunRefusedException(FormattableString.Invariant($"--horizon {horizon} is not a positive time; give it in the follow-up column's unit, for example --horizon 24 for two years of months."));
        if (Horizon is not null && FollowUpColumn is null)
            throw new RunRefusedException("--horizon needs the cohort's follow-up: name its columns with --follow-up and --event.");
    }

    /// <summary>The panel load options when the outcome is known.</summary>
    public PanelLoadOptions ToLoadOptions() => new()
    {
        MatrixPath = MatrixPath,
        SampleSheetPath = SampleSheetPath,
        OutcomeColumn = OutcomeKnown ? OutcomeColumn : throw new InvalidOperationException("No outcome column."),
        FollowUpColumn = FollowUpColumn,
        EventColumn = EventColumn,
        SampleIdColumn = SampleIdColumn,
        AnnotationColumns = AnnotationColumns,
        Layout = Layout,
        DropUnmatchedSamples = DropUnmatchedSamples,
        FeatureColumns = FeatureColumns,
        ValueColumn = ValueColumn,
        DetectionLimitColumn = DetectionLimitColumn,
        BelowDetectionFlagColumn = BelowDetectionFlagColumn,
        QualityFlagColumn = QualityFlagColumn,
    };

    /// <summary>The long-table columns for reading the matrix alone (outcome unknown).</summary>
    public PanelLoadOptions MatrixColumns() => new()
    {
        MatrixPath = MatrixPath,
        OutcomeColumn = "",
        FeatureColumns = FeatureColumns,
        ValueColumn = ValueColumn,
        DetectionLimitColumn = DetectionLimitColumn,
        BelowDetectionFlagColumn = BelowDetectionFlagColumn,
        QualityFlagColumn = QualityFlagColumn,
    };
}
