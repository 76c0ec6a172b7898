namespace OmicsScreen.Data.Text;

/// <summary>
/// A sample (or feature) sheet as text: one array per column, in row order, with the line of each
/// row, and what was skipped or decompressed to read it (for `check` to state).
/// </summary>
internal sealed class SampleSheet
{
    private readonly Dictionary<string, int> _columnIndex;

    public SampleSheet(string path, char delimiter, string[] columnNames, string[][] columns, long[] lines)
    {
        Path = path;
        Delimiter = delimiter;
        ColumnNames = columnNames;
        Columns = columns;
        Lines = lines;
        _columnIndex = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int c = 0; c < columnNames.Length; c++) _columnIndex.TryAdd(columnNames[c], c);
    }

    public string Path { get; }
    public char Delimiter { get; }
    public string[] ColumnNames { get; }
    public string[][] Columns { get; }
    public long[] Lines { get; }

    /// <summary>True when the file was gzip-compressed and decompressed while reading.</summary>
    public bool Gzip { get; init; }

    /// <summary>Comment lines ('#' or '!') skipped above the header.</summary>
    public int CommentLineCount { get; init; }
    public int RowCount => Lines.Length;

    public string[]? Column(string name) => _columnIndex.TryGetValue(name, out int c) ? Columns[c] : null;

    public int IndexOf(string name) => _columnIndex.TryGetValue(name, out int c) ? c : -1;
}
