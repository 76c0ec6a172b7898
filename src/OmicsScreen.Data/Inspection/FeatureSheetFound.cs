namespace OmicsScreen.Data.Inspection;

/// <summary>What the feature sheet gave: its columns, the detection limits and the cells they censored, and the features matched.</summary>
/// <param name="Path">The feature sheet.</param>
/// <param name="IdColumn">Its feature id column (the first).</param>
/// <param name="DisplayNameColumn">The column of display names, or null.</param>
/// <param name="AnnotationColumns">Its other columns, kept as feature annotations.</param>
/// <param name="DetectionLimitColumn">The column of per-feature detection limits, or null.</param>
/// <param name="FeaturesWithLimit">Features of the panel with a detection limit.</param>
/// <param name="CensoredCells">Measured cells below their feature's limit, made below-detection, per feature that had any (most first).</param>
/// <param name="MatrixOnlyFeatures">Features of the matrix not in the sheet (dropped with --drop-unmatched).</param>
/// <param name="SheetOnlyFeatures">Features of the sheet not in the matrix (ignored with --drop-unmatched).</param>
public sealed record FeatureSheetFound(string Path, string IdColumn, string? DisplayNameColumn, IReadOnlyList<string> AnnotationColumns,
    string? DetectionLimitColumn, int FeaturesWithLimit, IReadOnlyList<FeatureCellCount> CensoredCells,
    IReadOnlyList<string> MatrixOnlyFeatures, IReadOnlyList<string> SheetOnlyFeatures)
{
    public long CensoredCellTotal => CensoredCells.Sum(c => (long)c.Cells);

    /// <summary>"gzip" when the sheet was decompressed while reading; null otherwise.</summary>
    public string? Compression { get; init; }

    /// <summary>Comment lines ('#' or '!') skipped above the sheet's header.</summary>
    public int CommentLineCount { get; init; }
}
