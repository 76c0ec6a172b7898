namespace OmicsScreen.Data.Text;

/// <summary>
/// Counts the leading feature-describing columns of a features-in-rows text file from its first
/// rows: the first column, then each next column that holds mostly text (cells that are neither
/// numbers nor missing or below-detection tokens), up to the first column that does not.
/// </summary>
/// <remarks>
/// A column is taken as text only when most of its non-missing cells are text, so a sample column
/// with one mistyped cell stays a sample column and its cell is reported as an error.
/// </remarks>
internal static class LeadingTextColumns
{
    public static int Count(string path, char delimiter, int columnCount, HashSet<string> sampleAttributeNames, int scannedRows)
    {
        using var text = DelimiterDetector.OpenText(path);
        var reader = new TextRowReader(text, delimiter);
        var row = new TextRow();
        bool headerSeen = false;
        var textCells = new int[columnCount];
        var valueCells = new int[columnCount];
        int rows = 0;
        while (rows < scannedRows && reader.Next(row))
        {
            if (row.IsBlank || DelimiterDetector.IsComment(row[0]))
            {
                if (headerSeen) break;
                continue;
            }
            if (!headerSeen)
            {
                headerSeen = true;
                continue;
            }
            if (row.FieldCount != columnCount || sampleAttributeNames.Contains(row[0].Trim().ToString())) continue;
            rows++;
            for (int c = 1; c < columnCount; c++)
            {
                var kind = CellText.Classify(row[c], out _);
                if (kind is CellKind.NotANumber) textCells[c]++;
                else if (kind is CellKind.Measured or CellKind.BelowDetection or CellKind.Infinite) valueCells[c]++;
            }
        }
        int leading = 1;
        while (leading < columnCount && textCells[leading] > 0 && textCells[leading] >= valueCells[leading]) leading++;
        // Every column text: no sample column at all; leave one so the reader reports the cells.
        return Math.Min(leading, columnCount - 1);
    }
}
