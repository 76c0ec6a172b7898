using System.Buffers.Binary;
using Parquet.Meta;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// Checks the Thrift metadata of a Parquet file (the footer, then every page header) before
/// Parquet.Net reads it: Parquet.Net 6 follows damaged Thrift list sizes without checking them
/// against the bytes present and can spin for hours on one flipped byte.
/// </summary>
/// <remarks>
/// Layout from the Apache Parquet format specification ("File format"): the file ends with the
/// Thrift FileMetaData, its length as a 4-byte little-endian integer, and the magic "PAR1"; each
/// column chunk is a run of pages, each a Thrift PageHeader whose field 3 is the
/// compressed_page_size of the page data that follows it.
/// </remarks>
internal static class ParquetLayoutCheck
{
    private const int MagicLength = 4;
    private const int FooterTailLength = 8;
    private const int CompressedPageSizeField = 3;
    private const int FirstHeaderWindow = 1 << 10;

    public static void EnsureFooter(string path, FileStream stream)
    {
        long fileLength = stream.Length;
        if (fileLength < MagicLength + FooterTailLength)
            throw Damaged(path, FormattableString.Invariant($"it is only {fileLength} bytes long, too short for the Parquet footer"));
        Span<byte> tail = stackalloc byte[FooterTailLength];
        stream.Position = fileLength - FooterTailLength;
        stream.ReadExactly(tail);
        if (!tail[MagicLength..].SequenceEqual("PAR1"u8))
            throw Damaged(path, "it does not end with the Parquet marker PAR1, so it was cut short");
        int metadataLength = BinaryPrimitives.ReadInt32LittleEndian(tail);
        if (metadataLength <= 0 || metadataLength > fileLength - MagicLength - FooterTailLength)
            throw Damaged(path, FormattableString.Invariant($"its footer gives a metadata length of {metadataLength} bytes, which the file cannot hold"));
        var metadata = new byte[metadataLength];
        stream.Position = fileLength - FooterTailLength - metadataLength;
        stream.ReadExactly(metadata);
        if (ThriftCompactCheck.StructLength(metadata, []) < 0)
            throw Damaged(path, "its file metadata (the footer) is not well-formed");
        stream.Position = 0;
    }

    /// <summary>Walks the page headers of every column chunk the metadata names.</summary>
    public static void EnsurePageHeaders(string path, FileStream stream, FileMetaData metadata)
    {
        long dataEnd = stream.Length - FooterTailLength;
        Span<long> headerIntegers = stackalloc long[CompressedPageSizeField + 1];
        var window = new byte[FirstHeaderWindow];
        foreach (var rowGroup in metadata.RowGroups)
        {
            foreach (var chunk in rowGroup.Columns)
            {
                if (chunk.MetaData is not { } column) continue;
                long start = column.DictionaryPageOffset is > 0 and var dictionary && dictionary < column.DataPageOffset
                    ? dictionary
                    : column.DataPageOffset;
                long end = start + column.TotalCompressedSize;
                if (start < MagicLength || column.TotalCompressedSize < 0 || end > dataEnd)
                    throw Damaged(path, "a column chunk lies outside the file");
                // Invariant: the pages in [start, position) have well-formed headers and lie inside
                // the file. Only the file's end is enforced, not the chunk's: a writer that
                // miscounts a chunk's size has written a readable file all the same.
                for (long position = start; position < end;)
                {
                    headerIntegers.Clear();
                    int headerLength = HeaderLength(stream, position, dataEnd, ref window, headerIntegers);
                    long pageLength = headerIntegers[CompressedPageSizeField];
                    if (headerLength < 0 || pageLength < 0 || position + headerLength + pageLength > dataEnd)
                        throw Damaged(path, FormattableString.Invariant($"the page header at byte {position} is not well-formed"));
                    position += headerLength + pageLength;
                }
            }
        }
        stream.Position = 0;
    }

    /// <summary>
    /// The length of the Thrift header at <paramref name="position"/>, read through a window that
    /// starts small (headers are usually tens of bytes) and doubles until the header fits.
    /// </summary>
    private static int HeaderLength(FileStream stream, long position, long end, ref byte[] window, Span<long> integers)
    {
        for (int size = FirstHeaderWindow; ; size *= 2)
        {
            int count = (int)Math.Min(size, end - position);
            if (window.Length < count) window = new byte[count];
            stream.Position = position;
            stream.ReadExactly(window, 0, count);
            int length = ThriftCompactCheck.StructLength(window.AsSpan(0, count), integers);
            if (length >= 0 || count == end - position || size >= Array.MaxLength / 2) return length;
        }
    }

    private static PanelInputException Damaged(string path, string problem) =>
        PanelInputException.At(path, null, null, $"starts like Parquet but cannot be read: {problem}.",
            "The file is probably truncated or damaged; write it again (and check the copy finished).");
}
