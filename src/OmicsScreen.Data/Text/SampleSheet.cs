namespace OmicsScreen.Data.Text;

/// <summary>A sample sheet as text: one array per column, in row order, with the line of each row.</summary>
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
    public int RowCount => Lines.Length;

    public string[]? Column(string name) => _columnIndex.TryGetValue(name, out int c) ? Columns[c] : null;

    public int IndexOf(string name) => _columnIndex.TryGetValue(name, out int c) ? c : -1;
}
