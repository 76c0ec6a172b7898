namespace OmicsScreen.Reporting.Tables;

/// <summary>
/// Writes records as a tab-separated table: one header row, then one row per record, lines ending
/// in "\n" whatever the platform so the bytes do not depend on the machine.
/// </summary>
/// <remarks>
/// Header cells go through the same sanitiser as text cells, because headers can carry class
/// names taken from the data (for example "median_&lt;class&gt;"). The writer does not own the
/// <see cref="TextWriter"/>: the caller opens it (atomically, for result files) and disposes it.
/// </remarks>
public sealed class TsvTableWriter<TRecord>
{
    /// <summary>Longest number text a cell can need: a 17-digit mantissa, sign, point and exponent fit easily.</summary>
    private const int NumberBufferLength = 64;

    private readonly TsvColumn<TRecord>[] _columns;

    public TsvTableWriter(IReadOnlyList<TsvColumn<TRecord>> columns)
    {
        ArgumentNullException.ThrowIfNull(columns);
        if (columns.Count == 0) throw new ArgumentException("A table needs at least one column.", nameof(columns));
        _columns = new TsvColumn<TRecord>[columns.Count];
        var headers = new HashSet<string>(StringComparer.Ordinal);
        for (int c = 0; c < _columns.Length; c++)
        {
            _columns[c] = columns[c] ?? throw new ArgumentException("A column is null.", nameof(columns));
            if (!headers.Add(SpreadsheetSafeText.Sanitise(_columns[c].Header)))
                throw new ArgumentException($"Two columns are both named '{_columns[c].Header}'.", nameof(columns));
        }
    }

    public IReadOnlyList<TsvColumn<TRecord>> Columns => _columns;

    /// <summary>Writes the header and every record; returns the number of data rows written.</summary>
    public int Write(TextWriter writer, IEnumerable<TRecord> records)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(records);
        WriteHeader(writer);
        Span<char> scratch = stackalloc char[NumberBufferLength];
        int rowCount = 0;
        foreach (var record in records)
        {
            WriteRow(writer, record, scratch);
            rowCount++;
        }
        return rowCount;
    }

    private void WriteHeader(TextWriter writer)
    {
        for (int c = 0; c < _columns.Length; c++)
        {
            if (c > 0) writer.Write('\t');
            writer.Write(SpreadsheetSafeText.Sanitise(_columns[c].Header));
        }
        writer.Write('\n');
    }

    private void WriteRow(TextWriter writer, TRecord record, Span<char> scratch)
    {
        for (int c = 0; c < _columns.Length; c++)
        {
            if (c > 0) writer.Write('\t');
            _columns[c].WriteCell(writer, record, scratch);
        }
        writer.Write('\n');
    }
}
