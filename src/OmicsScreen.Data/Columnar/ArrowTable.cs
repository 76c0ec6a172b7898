using System.Numerics;
using System.Text;
using Apache.Arrow;
using Apache.Arrow.Ipc;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// An Arrow IPC file or stream, all record batches in memory, read one column at a time.
/// Feature columns may be float, double, integer or (large/view) UTF-8 text.
/// </summary>
/// <remarks>
/// Apache.Arrow 23 trusts the lengths and offsets stored in a file. Every batch is therefore
/// checked on opening (one array per schema field, each as long as its batch), text is decoded
/// through the bounds-checked <c>GetBytes</c> rather than <c>StringArray.GetString</c> (which
/// reads through a raw pointer at the stored offsets, so damaged offsets crash the process), and
/// anything else a damaged buffer makes the library throw while a column is read becomes a
/// <see cref="PanelInputException"/>.
/// </remarks>
internal sealed class ArrowTable : IColumnarTable
{
    private readonly List<RecordBatch> _batches;

    private ArrowTable(string path, MatrixFileFormat format, Schema schema, List<RecordBatch> batches)
    {
        Path = path;
        Format = format;
        _batches = batches;
        var names = new string[schema.FieldsList.Count];
        for (int c = 0; c < names.Length; c++) names[c] = schema.FieldsList[c].Name.Trim();
        ColumnNames = names;
        long rows = 0;
        foreach (var batch in batches) rows += batch.Length;
        RowCount = checked((int)rows);
    }

    public string Path { get; }
    public MatrixFileFormat Format { get; }
    public IReadOnlyList<string> ColumnNames { get; }
    public int RowCount { get; }

    public static ArrowTable Open(string path, MatrixFileFormat format, CancellationToken ct)
    {
        var batches = new List<RecordBatch>();
        try
        {
            using var stream = File.OpenRead(path);
            var allocator = new FileBoundedAllocator(stream.Length);
            using ArrowStreamReader reader = format == MatrixFileFormat.ArrowFile
                ? new ArrowFileReader(stream, allocator, leaveOpen: true)
                : new ArrowStreamReader(stream, allocator, leaveOpen: true);
            while (reader.ReadNextRecordBatch() is { } batch)
            {
                ct.ThrowIfCancellationRequested();
                batches.Add(batch);
            }
            var schema = reader.Schema;
            long rows = 0;
            for (int b = 0; b < batches.Count; b++)
            {
                CheckShape(path, format, schema, batches[b], b);
                rows += batches[b].Length;
            }
            // A loadable table has a text id column, whose offsets take 4 bytes per row.
            if (rows > stream.Length)
                throw Damaged(path, format, FormattableString.Invariant(
                    $"its record batches claim {rows} rows, more than its {stream.Length} bytes can hold."));
            return new ArrowTable(path, format, schema, batches);
        }
        catch (Exception e) when (e is not PanelInputException and not OperationCanceledException)
        {
            foreach (var batch in batches) batch.Dispose();
            throw Damaged(path, format, e.Message, e);
        }
    }

    /// <summary>
    /// A record batch that disagrees with the schema or with itself cannot be read column by
    /// column: the Arrow format requires one array per field, each of the batch's length.
    /// </summary>
    private static void CheckShape(string path, MatrixFileFormat format, Schema schema, RecordBatch batch, int batchIndex)
    {
        if (batch.Length < 0 || batch.ColumnCount != schema.FieldsList.Count)
            throw Damaged(path, format, FormattableString.Invariant(
                $"record batch {batchIndex + 1} holds {batch.ColumnCount} columns of {batch.Length} rows but the schema has {schema.FieldsList.Count} fields."));
        for (int c = 0; c < batch.ColumnCount; c++)
        {
            var array = batch.Column(c);
            if (array.Length != batch.Length || array.Offset < 0)
                throw Damaged(path, format, FormattableString.Invariant(
                    $"in record batch {batchIndex + 1}, column {c + 1} holds {array.Length} rows but the batch {batch.Length}."));
        }
    }

    private static PanelInputException Damaged(string path, MatrixFileFormat format, string problem, Exception? inner = null) =>
        PanelInputException.At(path, null, null,
            $"starts like Arrow IPC ({(format == MatrixFileFormat.ArrowFile ? "file" : "stream")} format) but cannot be read: {problem}",
            "The file is probably truncated or damaged; write it again (and check the copy finished).", inner);

    public string?[] ReadText(int column) => Guard(column, () => ReadTextUnguarded(column));

    public bool TryReadCells(int column, Span<float> values, Span<CellState> states, ReadOnlySpan<bool> skipRows,
        out CellFailure failure)
    {
        try
        {
            return TryReadCellsUnguarded(column, values, states, skipRows, out failure);
        }
        catch (Exception e) when (IsDecodingFailure(e))
        {
            throw CannotDecode(column, e);
        }
    }

    private string?[] ReadTextUnguarded(int column)
    {
        var texts = new string?[RowCount];
        int row = 0;
        foreach (var batch in _batches)
        {
            var array = batch.Column(column);
            for (int i = 0; i < array.Length; i++, row++)
                texts[row] = array.IsNull(i) ? null : array switch
                {
                    StringArray or StringViewArray => Text(array, i),
                    FloatArray a => ColumnCells.FormatNumber(a.Values[i]),
                    DoubleArray a => ColumnCells.FormatNumber(a.Values[i]),
                    Int32Array a => ColumnCells.FormatNumber(a.Values[i]),
                    Int64Array a => ColumnCells.FormatNumber(a.Values[i]),
                    _ => throw UnsupportedType(column, array),
                };
        }
        return texts;
    }

    private bool TryReadCellsUnguarded(int column, Span<float> values, Span<CellState> states, ReadOnlySpan<bool> skipRows,
        out CellFailure failure)
    {
        int row = 0;
        foreach (var batch in _batches)
        {
            var array = batch.Column(column);
            bool stored = array switch
            {
                FloatArray a => StoreNumbers(a, row, values, states, out failure),
                DoubleArray a => StoreNumbers(a, row, values, states, out failure),
                Int32Array a => StoreNumbers(a, row, values, states, out failure),
                Int64Array a => StoreNumbers(a, row, values, states, out failure),
                StringArray or StringViewArray => StoreTexts(array, row, values, states, skipRows, out failure),
                _ => throw UnsupportedType(column, array),
            };
            if (!stored) return false;
            row += array.Length;
        }
        failure = default;
        return true;
    }

    private static bool StoreNumbers<T>(PrimitiveArray<T> array, int firstRow, Span<float> values, Span<CellState> states,
        out CellFailure failure)
        where T : struct, IEquatable<T>, INumberBase<T> =>
        ColumnCells.StoreNumbers(array.Values, array.NullCount > 0 ? array.IsNull : null, firstRow, values, states, out failure);

    private static bool StoreTexts(IArrowArray array, int firstRow, Span<float> values, Span<CellState> states,
        ReadOnlySpan<bool> skipRows, out CellFailure failure)
    {
        var texts = new string?[array.Length];
        for (int i = 0; i < texts.Length; i++) texts[i] = array.IsNull(i) ? null : Text(array, i);
        return ColumnCells.StoreTexts(texts, firstRow, values, states, skipRows, out failure);
    }

    /// <summary>One UTF-8 cell, sliced with bounds checks (see the remarks on the type for why not GetString).</summary>
    private static string Text(IArrowArray array, int index) => array is StringArray s
        ? Encoding.UTF8.GetString(s.GetBytes(index))
        : Encoding.UTF8.GetString(((StringViewArray)array).GetBytes(index));

    private T Guard<T>(int column, Func<T> read)
    {
        try
        {
            return read();
        }
        catch (Exception e) when (IsDecodingFailure(e))
        {
            throw CannotDecode(column, e);
        }
    }

    /// <summary>What the Arrow library throws when a buffer is shorter than its stored length or offsets say.</summary>
    private static bool IsDecodingFailure(Exception e) =>
        e is ArgumentException or IndexOutOfRangeException or InvalidOperationException or OverflowException
            or InvalidDataException;

    private PanelInputException CannotDecode(int column, Exception e) =>
        PanelInputException.At(Path, null, ColumnNames[column], $"cannot be decoded: {e.Message}",
            "The file is probably truncated or damaged; write it again (and check the copy finished).", e);

    private PanelInputException UnsupportedType(int column, IArrowArray array) =>
        PanelInputException.At(Path, null, ColumnNames[column],
            $"has the Arrow type {array.Data.DataType.Name}, which is neither a number nor text.",
            "Store features as float32 or float64 (and ids as utf8 text) and write the file again.");

    public void Dispose()
    {
        foreach (var batch in _batches) batch.Dispose();
    }
}
