using System.Numerics;
using OmicsScreen.Engine.Panels;
using Parquet;
using Parquet.Schema;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// A flat Parquet file read one column at a time with Parquet.Net 6, across all row groups.
/// Feature columns may be float, double, 32/64-bit integer or UTF-8 text.
/// </summary>
/// <remarks>
/// Parquet.Net's API is asynchronous; the loader is synchronous by contract and runs outside any
/// synchronisation context, so each call is awaited in place.
/// </remarks>
internal sealed class ParquetTable : IColumnarTable
{
    private const long MaxRowsPerByte = 8;

    private readonly FileStream _stream;
    private readonly ParquetReader _reader;
    private readonly DataField[] _fields;
    private readonly int[] _rowGroupStarts;

    private ParquetTable(string path, FileStream stream, ParquetReader reader, DataField[] fields, int[] rowGroupStarts,
        int rowCount)
    {
        Path = path;
        _stream = stream;
        _reader = reader;
        _fields = fields;
        _rowGroupStarts = rowGroupStarts;
        RowCount = rowCount;
        var names = new string[fields.Length];
        for (int c = 0; c < names.Length; c++) names[c] = fields[c].Name.Trim();
        ColumnNames = names;
    }

    public string Path { get; }
    public MatrixFileFormat Format => MatrixFileFormat.Parquet;
    public IReadOnlyList<string> ColumnNames { get; }
    public int RowCount { get; }

    public static ParquetTable Open(string path)
    {
        var stream = File.OpenRead(path);
        try
        {
            ParquetLayoutCheck.EnsureFooter(path, stream);
            var reader = ParquetReader.CreateAsync(stream).GetAwaiter().GetResult();
            var fields = reader.Schema.GetDataFields();
            foreach (var field in fields)
                if (field.IsArray || field.MaxRepetitionLevel > 0 || field.Path.ToList().Count > 1)
                    throw PanelInputException.At(path, null, field.Name,
                        "is a nested or repeated (list) column; a panel table must be flat.",
                        "Write one plain column per feature (or per sample) with a text id column.");
            var starts = new int[reader.RowGroupCount + 1];
            for (int g = 0; g < reader.RowGroupCount; g++)
            {
                long groupRows = reader.RowGroups[g].RowCount;
                // Every row holds a distinct id (or feature name), and distinct values need at
                // least one bit each in any encoding, so a file holds at most 8 rows per byte.
                if (groupRows < 0 || starts[g] + groupRows > MaxRowsPerByte * stream.Length)
                    throw PanelInputException.At(path, null, null, FormattableString.Invariant(
                        $"starts like Parquet but cannot be read: row group {g + 1} claims {groupRows} rows, more than the file's {stream.Length} bytes can hold."),
                        "The file is probably truncated or damaged; write it again (and check the copy finished).");
                starts[g + 1] = checked((int)(starts[g] + groupRows));
            }
            return new ParquetTable(path, stream, reader, fields, starts, starts[^1]);
        }
        catch (Exception e) when (e is not PanelInputException and not OperationCanceledException)
        {
            stream.Dispose();
            throw PanelInputException.At(path, null, null,
                $"starts like Parquet but cannot be read: {e.Message}",
                "The file is probably truncated or damaged; write it again (and check the copy finished).", e);
        }
    }

    public string?[] ReadText(int column)
    {
        var field = _fields[column];
        var texts = new string?[RowCount];
        if (IsText(field))
        {
            for (int g = 0; g < _reader.RowGroupCount; g++)
                Guard(() => Group(g).ReadAsync(field, texts.AsMemory(_rowGroupStarts[g], GroupRows(g))).AsTask());
            return texts;
        }
        int row = 0;
        bool isFloat = field.ClrType == typeof(float);
        ForEachNumberRun(field, (numbers, isNull) =>
        {
            for (int i = 0; i < numbers.Length; i++, row++)
                texts[row] = isNull is not null && isNull(i) ? null
                    : isFloat ? ColumnCells.FormatNumber((float)numbers[i]) : ColumnCells.FormatNumber(numbers[i]);
        });
        return texts;
    }

    public bool TryReadCells(int column, Span<float> values, Span<CellState> states, ReadOnlySpan<bool> skipRows,
        out CellFailure failure)
    {
        var field = _fields[column];
        if (IsText(field))
            return ColumnCells.StoreTexts(ReadText(column), 0, values, states, skipRows, out failure);
        var valueArray = new float[RowCount];
        var stateArray = new CellState[RowCount];
        CellFailure? first = null;
        int row = 0;
        ForEachNumberRun(field, (numbers, isNull) =>
        {
            if (first is null && !ColumnCells.StoreNumbers(numbers, isNull, row, valueArray, stateArray, out var f)) first = f;
            row += numbers.Length;
        });
        valueArray.CopyTo(values);
        stateArray.CopyTo(states);
        failure = first ?? default;
        return first is null;
    }

    /// <summary>Calls <paramref name="run"/> once per row group with that group's numbers, as double.</summary>
    private void ForEachNumberRun(DataField field, Action<ReadOnlySpan<double>, Func<int, bool>?> run)
    {
        var type = field.ClrType;
        if (type == typeof(float)) ForEachRun<float>(field, run);
        else if (type == typeof(double)) ForEachRun<double>(field, run);
        else if (type == typeof(int)) ForEachRun<int>(field, run);
        else if (type == typeof(long)) ForEachRun<long>(field, run);
        else if (type == typeof(short)) ForEachRun<short>(field, run);
        else
            throw PanelInputException.At(Path, null, field.Name,
                $"has the Parquet type {type.Name}, which is neither a number nor text.",
                "Store features as float or double (and ids as text) and write the file again.");
    }

    private void ForEachRun<T>(DataField field, Action<ReadOnlySpan<double>, Func<int, bool>?> run)
        where T : struct, INumberBase<T>
    {
        for (int g = 0; g < _reader.RowGroupCount; g++)
        {
            int count = GroupRows(g);
            var asDouble = new double[count];
            if (field.IsNullable)
            {
                var buffer = new T?[count];
                Guard(() => Group(g).ReadAsync(field, buffer.AsMemory()).AsTask());
                for (int i = 0; i < count; i++) asDouble[i] = buffer[i] is { } v ? double.CreateTruncating(v) : 0;
                run(asDouble, i => buffer[i] is null);
            }
            else
            {
                var buffer = new T[count];
                Guard(() => Group(g).ReadAsync(field, buffer.AsMemory()).AsTask());
                for (int i = 0; i < count; i++) asDouble[i] = double.CreateTruncating(buffer[i]);
                run(asDouble, null);
            }
        }
    }

    /// <summary>Parquet.Net 6 reports UTF-8 columns as ReadOnlyMemory&lt;char&gt;; older writers' schemas as string.</summary>
    private static bool IsText(DataField field) =>
        field.ClrType == typeof(string) || field.ClrType == typeof(ReadOnlyMemory<char>);

    private ParquetRowGroupReader Group(int g) => _reader.RowGroups[g];

    private int GroupRows(int g) => _rowGroupStarts[g + 1] - _rowGroupStarts[g];

    private void Guard(Func<Task> read)
    {
        try
        {
            read().GetAwaiter().GetResult();
        }
        catch (Exception e) when (e is not PanelInputException and not OperationCanceledException)
        {
            throw PanelInputException.At(Path, null, null, $"has a column that cannot be decoded: {e.Message}",
                "The file is probably truncated or damaged; write it again.", e);
        }
    }

    public void Dispose()
    {
        _reader.DisposeAsync().AsTask().GetAwaiter().GetResult();
        _stream.Dispose();
    }
}
