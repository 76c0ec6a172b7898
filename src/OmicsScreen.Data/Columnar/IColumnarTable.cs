using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// A Parquet or Arrow table seen as named columns of equal length, read a whole column at a
/// time. Both orientations of a panel are assembled from this one view, so the two formats can
/// only differ in how they decode a column.
/// </summary>
internal interface IColumnarTable : IDisposable
{
    string Path { get; }
    MatrixFileFormat Format { get; }
    IReadOnlyList<string> ColumnNames { get; }
    int RowCount { get; }

    /// <summary>Every cell as text: null for a null cell, numbers in invariant round-trip form.</summary>
    string?[] ReadText(int column);

    /// <summary>
    /// Reads a column as feature cells: numbers as measured (null and NaN as missing), text by
    /// the token rules of <see cref="Text.CellText"/>. Rows flagged in <paramref name="skipRows"/>
    /// (empty span: none) are not classified. On the first cell that is not a measurement returns
    /// false with that cell in <paramref name="failure"/>.
    /// </summary>
    bool TryReadCells(int column, Span<float> values, Span<CellState> states, ReadOnlySpan<bool> skipRows,
        out CellFailure failure);
}
