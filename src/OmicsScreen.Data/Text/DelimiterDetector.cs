using System.Text;

namespace OmicsScreen.Data.Text;

/// <summary>
/// Picks the field delimiter of a text table from its header line: the most frequent of tab,
/// comma and semicolon outside quotes. A header is the line least likely to hold decimal commas
/// or free text, which makes it the safest line to count on; when the first data rows disagree
/// with it and another delimiter appears exactly as often in every one of them as in the header,
/// that one is taken.
/// </summary>
internal static class DelimiterDetector
{
    private const int MaxHeaderChars = 4 << 20;

    /// <summary>Data lines compared with the header to confirm the delimiter.</summary>
    private const int CheckedDataLines = 5;

    public static char Detect(string path)
    {
        using var reader = OpenText(path);
        SkipCommentsAboveHeader(reader);
        var header = CountLine(reader, out bool wholeHeader);
        char chosen = ByHeader(header, path);
        if (!wholeHeader) return chosen;
        // Names may hold the other delimiters ("IL-6, serum" in a TSV) and outvote the real one in
        // the header; the real delimiter is the one every data row has as often as the header.
        var data = new List<int[]>();
        while (data.Count < CheckedDataLines && CountLine(reader, out bool wholeLine) is { } line)
        {
            if (!wholeLine) break;
            if (line[0] + line[1] + line[2] > 0) data.Add(line);
        }
        if (header is null || data.Count == 0 || IsConsistent(chosen, header, data)) return chosen;
        foreach (char candidate in new[] { '\t', ',', ';' })
            if (header[Slot(candidate)] > 0 && IsConsistent(candidate, header, data)) return candidate;
        return chosen;
    }

    /// <summary>The most frequent delimiter of the header; ties go to tab, then comma (a tab never appears inside an unquoted name by accident).</summary>
    private static char ByHeader(int[]? counts, string path)
    {
        if (counts is not null)
        {
            int tabs = counts[0], commas = counts[1], semicolons = counts[2];
            if (tabs > 0 && tabs >= commas && tabs >= semicolons) return '\t';
            if (commas > 0 && commas >= semicolons) return ',';
            if (semicolons > 0) return ';';
        }
        string extension = Path.GetExtension(path).ToLowerInvariant();
        return extension is ".tsv" or ".tab" or ".txt" ? '\t' : ',';
    }

    private static bool IsConsistent(char delimiter, int[] header, List<int[]> data)
    {
        int slot = Slot(delimiter);
        foreach (var line in data)
            if (line[slot] != header[slot]) return false;
        return true;
    }

    private static int Slot(char delimiter) => delimiter switch { '\t' => 0, ',' => 1, _ => 2 };

    /// <summary>
    /// Tabs, commas and semicolons outside quotes in the next row (a quoted field may run over
    /// line breaks), reading at most <see cref="MaxHeaderChars"/>; null at the end of the file.
    /// </summary>
    private static int[]? CountLine(StreamReader reader, out bool whole)
    {
        whole = true;
        var counts = new int[3];
        bool inQuotes = false, any = false;
        for (int read = 0; read < MaxHeaderChars; read++)
        {
            int next = reader.Read();
            if (next < 0) return any ? counts : null;
            any = true;
            char c = (char)next;
            if (c == '"') inQuotes = !inQuotes;
            else if (inQuotes) continue;
            else if (c == '\n') return counts;
            else if (c == '\r')
            {
                if (reader.Peek() == '\n') reader.Read();
                return counts;
            }
            else if (c == '\t') counts[0]++;
            else if (c == ',') counts[1]++;
            else if (c == ';') counts[2]++;
        }
        // A row longer than the scan: what was counted stands, and the rest of the file is not read.
        whole = false;
        return counts;
    }

    /// <summary>Comment lines above the header (an export's date, an instrument's name) and blank lines say nothing of the delimiter.</summary>
    private static void SkipCommentsAboveHeader(StreamReader reader)
    {
        while (reader.Peek() is int next and >= 0)
        {
            if (next is '#' or '!') reader.ReadLine();
            else if (next is '\n' or '\r') reader.Read();
            else return;
        }
    }

    /// <summary>
    /// True for a line that starts with '#' or '!': exports from laboratory systems put their date
    /// or instrument above the header after '#', and series-matrix files of public expression
    /// repositories their metadata after '!'. Such lines above the header are skipped (and
    /// counted), so a header may not itself start with either; inside the data they are an error.
    /// </summary>
    public static bool IsCommentAboveHeader(ReadOnlySpan<char> firstCell) => IsComment(firstCell);

    /// <summary>True when the first cell of a row starts (after spaces) with a comment mark, '#' or '!'.</summary>
    public static bool IsComment(ReadOnlySpan<char> firstCell)
    {
        var trimmed = firstCell.TrimStart();
        return trimmed.Length > 0 && trimmed[0] is '#' or '!';
    }

    /// <summary>The error for a comment line below the header, where it would be read as a sample or feature.</summary>
    public static PanelInputException CommentInsideData(string path, long line) =>
        PanelInputException.At(path, line, null,
            "starts with '#' or '!', a comment line inside the data; comment lines are read only above the header.",
            "Move the line above the header or delete it (if it is a sample id or feature name, rename it so it does not start with # or !).");

    /// <summary>Opens UTF-8 text (decompressed when the file is gzip), skipping a byte-order mark when there is one.</summary>
    public static StreamReader OpenText(string path) =>
        new(TextInput.Open(path), new UTF8Encoding(encoderShouldEmitUTF8Identifier: false), detectEncodingFromByteOrderMarks: true,
            bufferSize: 1 << 16, leaveOpen: false);

    /// <summary>The delimiter as a word for people: "comma", "tab", "semicolon".</summary>
    public static string Describe(char delimiter) => delimiter switch
    {
        ',' => "comma",
        '\t' => "tab",
        ';' => "semicolon",
        _ => $"'{delimiter}'",
    };
}
