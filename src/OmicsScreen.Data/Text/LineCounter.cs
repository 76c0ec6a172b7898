namespace OmicsScreen.Data.Text;

/// <summary>
/// Counts line breaks in a file at memory speed, without decoding any text; a gzip file is
/// decompressed once for the count (its compressed size says nothing of its rows).
/// </summary>
internal static class LineCounter
{
    /// <summary>An upper bound on the rows of a file: its line breaks plus one.</summary>
    public static int UpperBoundOfLines(string path)
    {
        var (breaks, _) = Scan(path);
        return (int)Math.Min(breaks + 1, Array.MaxLength);
    }

    /// <summary>The lines of a file, a last line without a final line break included, an empty last "line" after one not.</summary>
    public static long CountLines(string path)
    {
        var (breaks, endsWithBreak) = Scan(path);
        return endsWithBreak ? breaks : breaks + 1;
    }

    /// <summary>
    /// Every line ends in LF, CRLF or (old Mac exports) a bare CR, so the larger of the LF and CR
    /// counts is the number of line breaks.
    /// </summary>
    private static (long Breaks, bool EndsWithBreak) Scan(string path)
    {
        using var stream = TextInput.Open(path);
        var buffer = new byte[1 << 20];
        long lineFeeds = 0, carriageReturns = 0;
        byte last = (byte)'\n';
        int read;
        while ((read = stream.ReadAtLeast(buffer, buffer.Length, throwOnEndOfStream: false)) > 0)
        {
            var span = buffer.AsSpan(0, read);
            lineFeeds += span.Count((byte)'\n');
            carriageReturns += span.Count((byte)'\r');
            last = span[^1];
        }
        return (Math.Max(lineFeeds, carriageReturns), last is (byte)'\n' or (byte)'\r');
    }
}
