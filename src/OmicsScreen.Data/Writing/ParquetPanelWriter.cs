using OmicsScreen.Engine.Panels;
using Parquet;
using Parquet.Schema;

namespace OmicsScreen.Data.Writing;

/// <summary>
/// Writes a panel as a flat Parquet file in either orientation (see the loader for the layout:
/// a "sample_id" column and the sample attributes, then one column per feature; or a "feature"
/// column, then one column per sample). A panel converted once to Parquet loads much faster
/// than from text.
/// </summary>
public static class ParquetPanelWriter
{
    /// <param name="rowGroupRows">Rows per row group; 0 writes one row group.</param>
    /// <param name="includeSampleAttributes">False writes the measurements only, for use with a sample sheet.</param>
    public static void Write(Panel panel, string path, PanelLayout layout, int rowGroupRows = 0,
        bool includeSampleAttributes = true) =>
        WriteAsync(panel, path, layout, rowGroupRows, includeSampleAttributes).GetAwaiter().GetResult();

    private static async Task WriteAsync(Panel panel, string path, PanelLayout layout, int rowGroupRows,
        bool includeSampleAttributes)
    {
        var columns = PanelTableShape.Columns(panel, layout, includeSampleAttributes);
        var fields = new DataField[columns.Count];
        for (int c = 0; c < fields.Length; c++)
            fields[c] = columns[c].Numbers is not null ? new DataField<float?>(columns[c].Name) : new DataField<string>(columns[c].Name);
        int rowCount = columns[0].Texts!.Length;
        int groupRows = rowGroupRows > 0 ? rowGroupRows : Math.Max(1, rowCount);

        await using var stream = File.Create(path);
        await using var writer = await ParquetWriter.CreateAsync(new ParquetSchema(fields), stream);
        for (int start = 0; start < rowCount; start += groupRows)
        {
            int count = Math.Min(groupRows, rowCount - start);
            using var group = writer.CreateRowGroup();
            for (int c = 0; c < columns.Count; c++)
            {
                if (columns[c].Numbers is { } numbers)
                    await group.WriteAsync<float>(fields[c], numbers.AsMemory(start, count));
                else
                    await group.WriteAsync(fields[c], new ArraySegment<string?>(columns[c].Texts!, start, count)!);
            }
        }
    }
}
