namespace OmicsScreen.Data.Text;

/// <summary>
/// Opens the bytes of a text input, decompressing it on the fly when its content is gzip (the
/// name does not matter: public repositories serve .csv.gz, .txt.gz and unnamed downloads alike).
/// Every reader of matrix text goes through here, so plain and compressed files parse identically.
/// </summary>
internal static class TextInput
{
    private const int BufferBytes = 1 << 16;

    /// <summary>True when the file starts with the gzip magic bytes 1F 8B (RFC 1952, section 2.3.1).</summary>
    public static bool IsGzip(string path)
    {
        Span<byte> head = stackalloc byte[2];
        using var stream = File.OpenRead(path);
        return stream.ReadAtLeast(head, 2, throwOnEndOfStream: false) == 2 && head[0] == 0x1F && head[1] == 0x8B;
    }

    /// <summary>The file's bytes, decompressed when it is gzip; a damaged or truncated gzip file throws a <see cref="PanelInputException"/> naming it.</summary>
    public static Stream Open(string path)
    {
        var file = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, BufferBytes, FileOptions.SequentialScan);
        try
        {
            return IsGzip(path) ? new CheckedGzipStream(file, path) : file;
        }
        catch
        {
            file.Dispose();
            throw;
        }
    }
}
