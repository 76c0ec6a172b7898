namespace OmicsScreen.Data.Inspection;

/// <summary>How a long table (one row per sample and feature) was read: its columns and what its per-row rules did.</summary>
/// <param name="Rows">Data rows read.</param>
/// <param name="CellsBelowRowLimit">Measured values below their row's detection limit, made below detection.</param>
/// <param name="CellsFlaggedBelow">Cells made below detection by the below-detection flag.</param>
/// <param name="CellsFailingQuality">Cells made missing by the quality flag.</param>
/// <param name="CellsWithoutRow">Sample-feature pairs no row mentions, missing.</param>
public sealed record LongTableFound(string SampleColumn, string FeatureColumn, string ValueColumn, string? DetectionLimitColumn,
    string? BelowDetectionFlagColumn, string? QualityFlagColumn, long Rows, long CellsBelowRowLimit, long CellsFlaggedBelow,
    long CellsFailingQuality, long CellsWithoutRow);
