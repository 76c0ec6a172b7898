using OmicsScreen.Data.Assembly;

namespace OmicsScreen.Data;

/// <summary>Where a panel comes from and which columns say what.</summary>
public sealed record PanelLoadOptions
{
    /// <summary>The measurement matrix: CSV, TSV, Parquet or Arrow IPC (file or stream).</summary>
    public required string MatrixPath { get; init; }

    public PanelLayout Layout { get; init; } = PanelLayout.SamplesInRows;

    /// <summary>Optional CSV/TSV sample sheet joined to the matrix on sample id.</summary>
    public string? SampleSheetPath { get; init; }

    /// <summary>
    /// The outcome column, in the sample sheet or as an annotation column of the matrix file: classes
    /// or a measured quantity (see <see cref="OutcomeKind"/>). Null when the outcome is a time to an
    /// event, named by <see cref="FollowUpColumn"/> and <see cref="EventColumn"/> instead.
    /// </summary>
    public string? OutcomeColumn { get; init; }

    /// <summary>Whether <see cref="OutcomeColumn"/> holds classes or a measured quantity; default: decided from its values.</summary>
    public OutcomeKindChoice OutcomeKind { get; init; } = OutcomeKindChoice.Auto;

    /// <summary>The follow-up time column of a time-to-event outcome (numbers, not negative).</summary>
    public string? FollowUpColumn { get; init; }

    /// <summary>The event column of a time-to-event outcome: 1/0, true/false or yes/no (1: event observed, 0: censored).</summary>
    public string? EventColumn { get; init; }

    public string? CohortColumn { get; init; }

    /// <summary>
    /// Clinical covariates (sample-sheet columns, or declared text columns of the matrix file): numeric
    /// when every value parses as a number, categorical otherwise. A covariate with a missing value
    /// stops the load (naming the column and the count) rather than dropping samples, so every
    /// analysis keeps the same samples.
    /// </summary>
    public IReadOnlyList<string> CovariateColumns { get; init; } = [];

    public string? SubjectColumn { get; init; }

    /// <summary>The class scored as positive; defaults to the smallest class.</summary>
    public string? PositiveClass { get; init; }

    /// <summary>
    /// The sample id column of a samples-in-rows matrix (which must have it) and of the sample
    /// sheet (its first column when it has no column of that name). Default: the first column.
    /// With features in rows the sample ids are the header of the matrix and this names only the
    /// sheet's id column.
    /// </summary>
    public string? SampleIdColumn { get; init; }

    /// <summary>Other non-numeric columns of the matrix file, kept as text sample attributes.</summary>
    public IReadOnlyList<string> AnnotationColumns { get; init; } = [];

    /// <summary>Drop samples found in only one of matrix and sample sheet, with a warning, instead of stopping.</summary>
    public bool DropUnmatchedSamples { get; init; }

    /// <summary>
    /// Read only this block of the feature columns (samples-in-rows files): the rest are never
    /// stored, so a node needs memory for its block alone.
    /// </summary>
    public FeatureBlock? FeatureBlock { get; init; }

    /// <summary>
    /// Read only the feature columns of these names (samples-in-rows files), for example the
    /// candidates kept from the screens of all blocks; a name not in the file is an error.
    /// </summary>
    public IReadOnlyList<string>? KeepFeatures { get; init; }

    /// <summary>
    /// The columns of a features-in-rows (or long) file that describe features; the first names
    /// the feature, the others travel with it as annotations. Null: in features-in-rows text, the
    /// first column and the text columns after it up to the first column of numbers.
    /// </summary>
    public IReadOnlyList<string>? FeatureColumns { get; init; }

    /// <summary>The describing column (of the feature sheet or the matrix) holding each feature's lab-facing name. Default: a feature-sheet column named display_name.</summary>
    public string? DisplayNameColumn { get; init; }

    /// <summary>Optional CSV/TSV feature sheet joined to the matrix on feature id: display names, annotations, detection limits.</summary>
    public string? FeatureSheetPath { get; init; }

    /// <summary>
    /// The column holding detection limits: per feature in the feature sheet, per row in a long
    /// table. Default: a column named detection_limit, when there is one.
    /// </summary>
    public string? DetectionLimitColumn { get; init; }

    /// <summary>The value column of a long table. Default: value.</summary>
    public string? ValueColumn { get; init; }

    /// <summary>A long table's per-row below-detection flag column (set: the cell is below detection). Default: none.</summary>
    public string? BelowDetectionFlagColumn { get; init; }

    /// <summary>A long table's per-row quality flag column (set: the cell failed a quality check and is missing). Default: none.</summary>
    public string? QualityFlagColumn { get; init; }

    /// <summary>Limits read from the feature sheet before the matrix, applied by the readers as they build columns.</summary>
    internal DetectionLimits? FeatureLimits { get; init; }

    /// <summary>The columns that describe samples rather than measure them: outcome (or follow-up and event), cohort, subject and annotations.</summary>
    internal HashSet<string> SampleAttributeNames()
    {
        var names = new HashSet<string>(StringComparer.Ordinal);
        if (OutcomeColumn is not null) names.Add(OutcomeColumn);
        if (FollowUpColumn is not null) names.Add(FollowUpColumn);
        if (EventColumn is not null) names.Add(EventColumn);
        if (CohortColumn is not null) names.Add(CohortColumn);
        if (SubjectColumn is not null) names.Add(SubjectColumn);
        foreach (var name in AnnotationColumns) names.Add(name);
        return names;
    }
}
