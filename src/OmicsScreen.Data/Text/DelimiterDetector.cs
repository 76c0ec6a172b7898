using System.Text;

namespace OmicsScreen.Data.Text;

/// <summary>
/// Picks the field delimiter of a text table from its header line: the most frequent of tab,
/// comma and semicolon outside quotes. A header is the line least likely to hold decimal commas
/// or free text, which makes it the safest line to count on.
/// </summary>
internal static class DelimiterDetector
{
    private const int MaxHeaderChars = 4 << 20;

    public static char Detect(string path)
    {
        using var reader = OpenText(path);
        int tabs = 0, commas = 0, semicolons = 0;
        bool inQuotes = false;
        bool lineStart = true;
        for (int read = 0; read < MaxHeaderChars; read++)
        {
            int next = reader.Read();
            if (next < 0) break;
            char c = (char)next;
            // Comment lines above the header (an export's date, an instrument's name) say nothing of the delimiter.
            if (lineStart && c == '#')
            {
                reader.ReadLine();
                continue;
            }
            if (lineStart && c is '\n' or '\r') continue;
            lineStart = false;
            if (c == '"') inQuotes = !inQuotes;
            else if (inQuotes) continue;
            else if (c is '\n' or '\r') break;
            else if (c == '\t') tabs++;
            else if (c == ',') commas++;
            else if (c == ';') semicolons++;
        }
        // Ties go to tab, then comma: a tab never appears inside an unquoted name by accident.
        if (tabs > 0 && tabs >= commas && tabs >= semicolons) return '\t';
        if (commas > 0 && commas >= semicolons) return ',';
        if (semicolons > 0) return ';';
        string extension = Path.GetExtension(path).ToLowerInvariant();
        return extension is ".tsv" or ".tab" or ".txt" ? '\t' : ',';
    }

    /// <summary>Opens UTF-8 text, skipping a byte-order mark when there is one.</summary>
    /// <summary>
    /// True for a line above the header that starts with '#': exports from laboratory systems put
    /// their date or instrument there. Such lines are skipped, so a header may not itself start with '#'.
    /// </summary>
    public static bool IsCommentAboveHeader(ReadOnlySpan<char> firstCell) => firstCell.TrimStart().StartsWith('#');

    public static StreamReader OpenText(string path) =>
        new(path, new UTF8Encoding(encoderShouldEmitUTF8Identifier: false), detectEncodingFromByteOrderMarks: true,
            new FileStreamOptions { Access = FileAccess.Read, BufferSize = 1 << 16, Options = FileOptions.SequentialScan });

    /// <summary>The delimiter as a word for people: "comma", "tab", "semicolon".</summary>
    public static string Describe(char delimiter) => delimiter switch
    {
        ',' => "comma",
        '\t' => "tab",
        ';' => "semicolon",
        _ => $"'{delimiter}'",
    };
}
