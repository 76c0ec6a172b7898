using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Inspection;

/// <summary>
/// What the loader found in a panel, as plain values for the CLI to print as a table or JSON.
/// Problems a user should see together are <see cref="Findings"/>; <see cref="CanScreen"/> is
/// false when any of them is an Error.
/// </summary>
public sealed record PanelInspection
{
    public required string MatrixPath { get; init; }
    public required MatrixFileFormat FileFormat { get; init; }
    /// <summary>"comma", "tab" or "semicolon" for text files; null for Parquet and Arrow.</summary>
    public string? Delimiter { get; init; }
    /// <summary>"gzip" when the text was decompressed while reading; null otherwise.</summary>
    public string? Compression { get; init; }
    /// <summary>Comment lines ('#' or '!') skipped above the header of a text matrix.</summary>
    public int CommentLineCount { get; init; }
    /// <summary>The feature-describing columns of a features-in-rows or long file; null when features are columns.</summary>
    public FeatureColumnsFound? FeatureColumns { get; init; }
    /// <summary>What the feature sheet gave, when one was joined.</summary>
    public FeatureSheetFound? FeatureSheet { get; init; }
    /// <summary>How a long table was read, for that layout.</summary>
    public LongTableFound? LongTable { get; init; }
    public required PanelLayout Layout { get; init; }
    public string? SampleSheetPath { get; init; }
    /// <summary>"gzip" when the sample sheet was decompressed while reading; null otherwise.</summary>
    public string? SampleSheetCompression { get; init; }
    /// <summary>Comment lines ('#' or '!') skipped above the sample sheet's header.</summary>
    public int SampleSheetCommentLineCount { get; init; }

    public required int SampleCount { get; init; }
    public required int FeatureCount { get; init; }

    /// <summary>Classes, a measured quantity or a time to an event.</summary>
    public OutcomeKind OutcomeKind { get; init; } = OutcomeKind.Classes;
    /// <summary>The outcome column; for a time to an event, the follow-up time column.</summary>
    public required string OutcomeColumn { get; init; }
    /// <summary>The event column of a time-to-event outcome; null for the other kinds.</summary>
    public string? EventColumn { get; init; }
    /// <summary>Classes in class-code order (ordinal by name), with sample counts; empty unless the outcome is classes.</summary>
    public required IReadOnlyList<LevelCount> Classes { get; init; }
    /// <summary>The class scored as positive; null unless the outcome is classes.</summary>
    public string? PositiveClass { get; init; }

    public string? CohortColumn { get; init; }
    public IReadOnlyList<LevelCount> Cohorts { get; init; } = [];
    /// <summary>Samples per class and cohort, every combination listed (zeros included).</summary>
    public IReadOnlyList<ClassCohortCount> ClassesByCohort { get; init; } = [];
    /// <summary>The covariates named by --covariates, in that order.</summary>
    public IReadOnlyList<CovariateSummary> Covariates { get; init; } = [];
    public string? SubjectColumn { get; init; }
    public int SubjectCount { get; init; }

    /// <summary>Missing cells over all cells (below-detection cells are not missing).</summary>
    public required double MissingFraction { get; init; }
    /// <summary>The features with the highest missing fraction (only those with any), worst first.</summary>
    public required IReadOnlyList<FeatureFraction> MostMissingFeatures { get; init; }
    public required long BelowDetectionCellCount { get; init; }
    public required int BelowDetectionFeatureCount { get; init; }
    /// <summary>Features whose non-missing cells all hold one value (entirely missing ones excluded).</summary>
    public required IReadOnlyList<string> ConstantFeatures { get; init; }
    public required IReadOnlyList<string> AllMissingFeatures { get; init; }
    /// <summary>Samples dropped because they were in only one of matrix and sample sheet.</summary>
    public IReadOnlyList<string> DroppedSamples { get; init; } = [];

    public required IReadOnlyList<InspectionFinding> Findings { get; init; }

    public bool CanScreen
    {
        get
        {
            foreach (var finding in Findings)
                if (finding.Severity == FindingSeverity.Error) return false;
            return true;
        }
    }
}
