using OmicsScreen.Data.Assembly;
using OmicsScreen.Data.Columnar;
using OmicsScreen.Data.Text;

namespace OmicsScreen.Data.Sizing;

/// <summary>
/// Finds the dimensions of a matrix file cheaply, before loading it: CSV/TSV from the header's
/// cell count and a count of line breaks, Parquet from its footer, Arrow IPC from its schema and
/// the row counts in its record-batch headers (bodies are skipped, never read).
/// </summary>
/// <remarks>
/// The roles of header columns (sample id, outcome, cohort, subject, annotations) are resolved
/// exactly as the loader resolves them, so a samples-in-rows file gives the loaded panel's
/// feature count. A file this cannot size (compressed, damaged, unreadable) gives null: the
/// loader then reads it and reports the problem with its usual message.
/// </remarks>
public static class PanelDimensionReader
{
    public static PanelDimensions? TryRead(PanelLoadOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        try
        {
            return Read(options);
        }
        // Sizing is advisory: whatever stops it, the loader reads the file next and reports the
        // problem with its own, precise message.
        catch (Exception e) when (e is not OutOfMemoryException and not OperationCanceledException)
        {
            return null;
        }
    }

    private static PanelDimensions? Read(PanelLoadOptions options)
    {
        string path = options.MatrixPath;
        if (!File.Exists(path)) return null;
        var format = MatrixFormatDetector.Detect(path);
        if (options.Layout == PanelLayout.Long)
        {
            if (format != MatrixFileFormat.DelimitedText) return null;
            var (samples, features) = LongTableReader.CountDimensions(path, options);
            return samples > 0 && features > 0 ? new PanelDimensions(samples, features, format, new FileInfo(path).Length, PanelLayout.Long) : null;
        }
        IReadOnlyList<string> columns;
        long rows;
        switch (format)
        {
            case MatrixFileFormat.DelimitedText:
                columns = DelimitedMatrixReader.ReadHeaderCells(path);
                // Lines after the header: blank lines, if any, make this an upper bound.
                rows = LineCounter.CountLines(path) - 1;
                break;
            case MatrixFileFormat.Parquet:
                using (var table = ParquetTable.Open(path))
                {
                    columns = table.ColumnNames;
                    rows = table.RowCount;
                }
                break;
            default:
                columns = ArrowRowCounter.ColumnNames(path, format);
                rows = ArrowRowCounter.CountRows(path, format);
                break;
        }
        if (rows < 1 || columns.Count < 2) return null;
        int rowCount = checked((int)rows);
        long fileBytes = new FileInfo(path).Length;
        if (options.Layout == PanelLayout.FeaturesInRows)
            return new PanelDimensions(columns.Count - 1, rowCount, format, fileBytes, PanelLayout.FeaturesInRows);
        var roles = SampleColumnRoles.Resolve(columns, options, path, isTableRow: format != MatrixFileFormat.DelimitedText);
        return new PanelDimensions(rowCount, roles.FeatureColumns.Length, format, fileBytes);
    }
}
