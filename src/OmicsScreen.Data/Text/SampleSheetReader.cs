using nietras.SeparatedValues;

namespace OmicsScreen.Data.Text;

/// <summary>
/// Reads a CSV/TSV sample or feature sheet as text, every value trimmed, with the same rules as
/// matrices: delimiter detection, gzip found by content, comment lines above the header skipped
/// and counted, a comment line inside the data refused.
/// </summary>
/// <remarks>
/// Every column stays text: sample ids such as "007" must not become numbers, and the outcome
/// may be coded 0/1. A general data-frame loader would infer column types, so Sep is used here too.
/// </remarks>
internal static class SampleSheetReader
{
    /// <param name="role">What the sheet is, in the user's words: "sample sheet" or "feature sheet".</param>
    /// <param name="rowNoun">What one row describes: "sample" or "feature".</param>
    public static SampleSheet Read(string path, string role = "sample sheet", string rowNoun = "sample")
    {
        try
        {
            return ReadRows(path, role, rowNoun);
        }
        catch (Exception e) when (LongRows.IsRowTooLong(e))
        {
            // A sample sheet has a handful of columns, so a row past the reader's buffer is all but
            // always a quote that is never closed, which turns the rest of the file into one row.
            throw PanelInputException.At(path, null, null,
                FormattableString.Invariant($"has a row longer than the {LongRows.MaxRowChars / (1024 * 1024)} Mi characters a {role} row may hold, most likely a quote that is never closed."),
                $"Close the open quote (or remove the stray quote character) so that each {rowNoun} has a row of its own.", e);
        }
    }

    private static SampleSheet ReadRows(string path, string role, string rowNoun)
    {
        InputFilePath.EnsureFile(path, role);
        if (new FileInfo(path).Length == 0)
            throw PanelInputException.At(path, null, null, "is empty (0 bytes).",
                rowNoun == "sample"
                    ? "Give a sample sheet with a header row (sample id, outcome, ...) and one row per sample."
                    : $"Give a {role} with a header row ({rowNoun} id, ...) and one row per {rowNoun}.");
        EnsureText(path, role);
        char delimiter = DelimiterDetector.Detect(path);
        using var text = DelimiterDetector.OpenText(path);
        using var reader = Sep.New(delimiter)
            .Reader(o => o with { HasHeader = false, Unescape = true, DisableColCountCheck = true })
            .From(text);
        string[]? header = null;
        List<string>[] columns = [];
        int commentLines = 0;
        var lines = new List<long>();
        foreach (var row in reader)
        {
            if (row.ColCount == 1 && row[0].Span.Trim().IsEmpty) continue;
            if (DelimiterDetector.IsComment(row[0].Span))
            {
                // Below the header such a row would become a sample (or feature) named '#...'.
                if (header is not null) throw DelimiterDetector.CommentInsideData(path, row.LineNumberFrom);
                commentLines++;
                continue;
            }
            if (header is null)
            {
                header = new string[row.ColCount];
                for (int c = 0; c < header.Length; c++) header[c] = row[c].Span.Trim().ToString();
                columns = new List<string>[header.Length];
                for (int c = 0; c < columns.Length; c++) columns[c] = [];
                continue;
            }
            if (row.ColCount != header.Length)
                throw PanelInputException.At(path, row.LineNumberFrom, null,
                    FormattableString.Invariant($"the row has {row.ColCount} fields but the header has {header.Length}."),
                    "Fix the row (a stray delimiter, or an unquoted text field containing one); every row needs one field per header column.");
            for (int c = 0; c < header.Length; c++) columns[c].Add(row[c].Span.Trim().ToString());
            lines.Add(row.LineNumberFrom);
        }
        if (header is null)
            throw PanelInputException.At(path, null, null, "holds no text rows (it is blank).",
                $"Give a {role} with a header row and one row per {rowNoun}.");
        if (lines.Count == 0)
            throw PanelInputException.At(path, null, null, $"has a header row but no {rowNoun} rows.",
                $"Add one row per {rowNoun} to the {role}.");
        var arrays = new string[columns.Length][];
        for (int c = 0; c < arrays.Length; c++) arrays[c] = columns[c].ToArray();
        return new SampleSheet(path, delimiter, header, arrays, lines.ToArray())
        {
            Gzip = TextInput.IsGzip(path),
            CommentLineCount = commentLines,
        };
    }

    /// <summary>
    /// Refuses a binary sheet before parsing, which would otherwise see one garbled "header" and
    /// report no sample rows. A gzip sheet is judged by its decompressed bytes, as the matrix is. A
    /// UTF-16 sheet starts with its byte-order mark (FF FE or FE FF) and is decoded as text, so its
    /// zero bytes are expected.
    /// </summary>
    private static void EnsureText(string path, string role)
    {
        Span<byte> head = stackalloc byte[4096];
        int length;
        using (var stream = TextInput.Open(path)) length = stream.ReadAtLeast(head, head.Length, throwOnEndOfStream: false);
        head = head[..length];
        bool utf16 = head.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFE]) || head.StartsWith((ReadOnlySpan<byte>)[0xFE, 0xFF]);
        if (!utf16 && head.Contains((byte)0))
            throw PanelInputException.At(path, null, null,
                TextInput.IsGzip(path) ? "is gzip-compressed but does not hold text (it holds zero bytes)." : "is not a text file (it holds zero bytes).",
                $"Give the {role} as CSV or TSV text, plain or gzip-compressed; Excel workbooks must be saved as CSV first.");
    }
}
