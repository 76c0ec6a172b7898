using System.Numerics;
using Apache.Arrow;
using Apache.Arrow.Ipc;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// An Arrow IPC file or stream, all record batches in memory, read one column at a time.
/// Feature columns may be float, double, integer or (large/view) UTF-8 text.
/// </summary>
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
            using ArrowStreamReader reader = format == MatrixFileFormat.ArrowFile
                ? new ArrowFileReader(stream, leaveOpen: true)
                : new ArrowStreamReader(stream, leaveOpen: true);
            while (reader.ReadNextRecordBatch() is { } batch)
            {
                ct.ThrowIfCancellationRequested();
                batches.Add(batch);
            }
            var schema = reader.Schema;
            return new ArrowTable(path, format, schema, batches);
        }
        catch (Exception e) when (e is not PanelInputException and not OperationCanceledException)
        {
            foreach (var batch in batches) batch.Dispose();
            throw PanelInputException.At(path, null, null,
                $"starts like Arrow IPC ({(format == MatrixFileFormat.ArrowFile ? "file" : "stream")} format) but cannot be read: {e.Message}",
                "The file is probably truncated or damaged; write it again (and check the copy finished).", e);
        }
    }

    public string?[] ReadText(int column)
    {
        var texts = new string?[RowCount];
        int row = 0;
        foreach (var batch in _batches)
        {
            var array = batch.Column(column);
            for (int i = 0; i < array.Length; i++, row++)
                texts[row] = array.IsNull(i) ? null : array switch
                {
                    StringArray s => s.GetString(i),
                    StringViewArray s => s.GetString(i),
                    FloatArray a => ColumnCells.FormatNumber(a.Values[i]),
                    DoubleArray a => ColumnCells.FormatNumber(a.Values[i]),
                    Int32Array a => ColumnCells.FormatNumber(a.Values[i]),
                    Int64Array a => ColumnCells.FormatNumber(a.Values[i]),
                    _ => throw UnsupportedType(column, array),
                };
        }
        return texts;
    }

    public bool TryReadCells(int column, Span<float> values, Span<CellState> states, ReadOnlySpan<bool> skipRows,
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
        for (int i = 0; i < texts.Length; i++)
            texts[i] = array.IsNull(i) ? null : array is StringArray s ? s.GetString(i) : ((StringViewArray)array).GetString(i);
        return ColumnCells.StoreTexts(texts, firstRow, values, states, skipRows, out failure);
    }

    private PanelInputException UnsupportedType(int column, IArrowArray array) =>
        PanelInputException.At(Path, null, ColumnNames[column],
            $"has the Arrow type {array.Data.DataType.Name}, which is neither a number nor text.",
            "Store features as float32 or float64 (and ids as utf8 text) and write the file again.");

    public void Dispose()
    {
        foreach (var batch in _batches) batch.Dispose();
    }
}
