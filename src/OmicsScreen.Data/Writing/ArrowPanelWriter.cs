using Apache.Arrow;
using Apache.Arrow.Ipc;
using Apache.Arrow.Types;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Writing;

/// <summary>
/// Writes a panel as an Arrow IPC file or stream in either orientation, with the same table
/// shape as <see cref="ParquetPanelWriter"/>.
/// </summary>
public static class ArrowPanelWriter
{
    /// <param name="asStream">True for the IPC streaming format, false for the IPC file format.</param>
    /// <param name="batchRows">Rows per record batch; 0 writes one batch.</param>
    /// <param name="includeSampleAttributes">False writes the measurements only, for use with a sample sheet.</param>
    public static void Write(Panel panel, string path, PanelLayout layout, bool asStream = false, int batchRows = 0,
        bool includeSampleAttributes = true)
    {
        var columns = PanelTableShape.Columns(panel, layout, includeSampleAttributes);
        var schemaBuilder = new Schema.Builder();
        foreach (var column in columns)
            schemaBuilder.Field(f => f.Name(column.Name)
                .DataType(column.Numbers is not null ? FloatType.Default : StringType.Default).Nullable(true));
        var schema = schemaBuilder.Build();
        int rowCount = columns[0].Texts!.Length;
        int rowsPerBatch = batchRows > 0 ? batchRows : Math.Max(1, rowCount);

        using var stream = File.Create(path);
        using ArrowStreamWriter writer = asStream ? new ArrowStreamWriter(stream, schema) : new ArrowFileWriter(stream, schema);
        for (int start = 0; start < rowCount; start += rowsPerBatch)
        {
            int count = Math.Min(rowsPerBatch, rowCount - start);
            var arrays = new IArrowArray[columns.Count];
            for (int c = 0; c < arrays.Length; c++)
                arrays[c] = columns[c].Numbers is { } numbers ? Numbers(numbers, start, count) : Texts(columns[c].Texts!, start, count);
            using var batch = new RecordBatch(schema, arrays, count);
            writer.WriteRecordBatch(batch);
        }
        writer.WriteEnd();
    }

    private static FloatArray Numbers(float?[] numbers, int start, int count)
    {
        var builder = new FloatArray.Builder().Reserve(count);
        for (int i = start; i < start + count; i++)
        {
            if (numbers[i] is { } value) builder.Append(value);
            else builder.AppendNull();
        }
        return builder.Build();
    }

    private static StringArray Texts(string?[] texts, int start, int count)
    {
        var builder = new StringArray.Builder();
        for (int i = start; i < start + count; i++)
        {
            if (texts[i] is { } text) builder.Append(text);
            else builder.AppendNull();
        }
        return builder.Build();
    }
}
