namespace OmicsScreen.Data;

/// <summary>
/// Tells the format of a matrix file from its first bytes; the extension only sharpens the error
/// when the two disagree.
/// </summary>
/// <remarks>
/// Magic numbers: Parquet files start (and end) with "PAR1"; Arrow IPC files start with
/// "ARROW1"; an Arrow IPC stream starts with the 0xFFFFFFFF continuation marker of its first
/// message (Apache Arrow columnar format specification, "IPC Streaming Format").
/// </remarks>
public static class MatrixFormatDetector
{
    private static readonly string[] ParquetExtensions = [".parquet", ".pq"];
    private static readonly string[] ArrowExtensions = [".arrow", ".arrows", ".feather", ".ipc"];

    public static MatrixFileFormat Detect(string path)
    {
        Span<byte> head = stackalloc byte[4096];
        int length;
        try
        {
            using var stream = File.OpenRead(path);
            length = stream.ReadAtLeast(head, head.Length, throwOnEndOfStream: false);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw PanelInputException.At(path, null, null, $"cannot be opened ({e.Message}).",
                "Check the path and that the file is readable.", e);
        }
        head = head[..length];
        if (length == 0)
            throw PanelInputException.At(path, null, null, "is empty (0 bytes).",
                "Export the matrix again; a matrix file needs a header row and at least one sample.");
        if (head.StartsWith("PAR1"u8)) return MatrixFileFormat.Parquet;
        if (head.StartsWith("ARROW1"u8)) return MatrixFileFormat.ArrowFile;
        if (head.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFF, 0xFF, 0xFF])) return MatrixFileFormat.ArrowStream;

        // UTF-16 byte-order marks (FF FE little-endian, FE FF big-endian; Unicode Standard, section 23.8)
        // and the gzip magic 1F 8B (RFC 1952, section 2.3.1) are named so the fix is clear: both
        // would otherwise read as "unknown binary".
        if (head.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFE]) || head.StartsWith((ReadOnlySpan<byte>)[0xFE, 0xFF]))
            throw PanelInputException.At(path, null, null, "is text encoded as UTF-16, which is not read.",
                "Save the file again as UTF-8 (\"CSV UTF-8\" in spreadsheet programs).");
        if (head.StartsWith((ReadOnlySpan<byte>)[0x1F, 0x8B])) return DetectCompressed(path);

        string extension = Path.GetExtension(path).ToLowerInvariant();
        if (ParquetExtensions.Contains(extension))
            throw PanelInputException.At(path, null, null,
                "is named as a Parquet file but does not start with the Parquet marker PAR1; it is damaged or not Parquet.",
                "Write the file again with a Parquet writer, or give the matrix as CSV/TSV.");
        if (ArrowExtensions.Contains(extension))
            throw PanelInputException.At(path, null, null,
                "is named as an Arrow file but starts with neither ARROW1 (IPC file) nor the IPC stream marker; it is damaged or not Arrow.",
                "Write the file again with an Arrow IPC writer, or give the matrix as CSV/TSV.");
        if (head.Contains((byte)0))
            throw PanelInputException.At(path, null, null,
                "is in an unknown binary format (it is not text, Parquet or Arrow IPC).",
                "Give the matrix as CSV, TSV, Parquet or Arrow IPC; Excel workbooks must be saved as CSV first.");
        return MatrixFileFormat.DelimitedText;
    }

    /// <summary>
    /// A gzip file is read as text when its content is text; compressed Parquet or Arrow files
    /// (which compress their own pages) and other binary content are named with the fix.
    /// </summary>
    private static MatrixFileFormat DetectCompressed(string path)
    {
        var head = new byte[4096];
        int length;
        using (var stream = Text.TextInput.Open(path))
        {
            try
            {
                length = stream.ReadAtLeast(head, head.Length, throwOnEndOfStream: false);
            }
            catch (EndOfStreamException e)
            {
                throw PanelInputException.At(path, null, null, "is gzip-compressed but truncated.", "Download or copy the file again and check it with `gzip -t`.", e);
            }
        }
        var content = head.AsSpan(0, length);
        if (length == 0)
            throw PanelInputException.At(path, null, null, "is gzip-compressed and holds nothing once decompressed.",
                "Compress the matrix file itself, not an empty file.");
        if (content.StartsWith("PAR1"u8) || content.StartsWith("ARROW1"u8) || content.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFF, 0xFF, 0xFF]))
            throw PanelInputException.At(path, null, null, "is a gzip-compressed Parquet or Arrow file, which is not read.",
                "Decompress it first (gunzip): Parquet and Arrow compress their own data, so give the file as written.");
        if (content.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFE]) || content.StartsWith((ReadOnlySpan<byte>)[0xFE, 0xFF]))
            throw PanelInputException.At(path, null, null, "is gzip-compressed text encoded as UTF-16, which is not read.",
                "Decompress it, save it again as UTF-8, and compress it again if you like.");
        if (content.Contains((byte)0))
            throw PanelInputException.At(path, null, null, "is gzip-compressed but holds binary content, not CSV/TSV text.",
                "Decompress it and check what it holds; give the matrix as CSV, TSV (plain or gzip), Parquet or Arrow IPC.");
        return MatrixFileFormat.DelimitedText;
    }
}
