namespace OmicsScreen.Reporting.Html;

/// <summary>
/// A table for the report: a caption, columns and rows of already formatted cell text. The cells
/// are plain text; <see cref="HtmlBuilder"/> encodes them, so names from the data are safe here.
/// </summary>
public sealed class HtmlTable
{
    private readonly HtmlTableColumn[] _columns;
    private readonly List<string[]> _rows = [];

    public HtmlTable(string caption, IReadOnlyList<HtmlTableColumn> columns)
    {
        ArgumentNullException.ThrowIfNull(caption);
        ArgumentNullException.ThrowIfNull(columns);
        if (columns.Count == 0) throw new ArgumentException("A table needs at least one column.", nameof(columns));
        Caption = caption;
        _columns = new HtmlTableColumn[columns.Count];
        for (int c = 0; c < _columns.Length; c++) _columns[c] = columns[c] ?? throw new ArgumentException("A column is null.", nameof(columns));
    }

    public string Caption { get; }

    public IReadOnlyList<HtmlTableColumn> Columns => _columns;

    public IReadOnlyList<IReadOnlyList<string>> Rows => _rows;

    /// <summary>When true the first cell of each row is marked as the row's header (screen readers announce it with each cell).</summary>
    public bool FirstColumnIsRowHeader { get; init; } = true;

    /// <summary>Appends a row; it must have one cell per column (null is written as an empty cell).</summary>
    public HtmlTable AddRow(params string?[] cells)
    {
        ArgumentNullException.ThrowIfNull(cells);
        if (cells.Length != _columns.Length)
            throw new ArgumentException($"The row has {cells.Length} cells; the table has {_columns.Length} columns.", nameof(cells));
        var row = new string[cells.Length];
        for (int c = 0; c < row.Length; c++) row[c] = cells[c] ?? string.Empty;
        _rows.Add(row);
        return this;
    }
}
