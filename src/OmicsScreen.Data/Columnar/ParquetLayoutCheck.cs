using System.Buffers.Binary;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// Checks the Thrift file metadata (the footer) of a Parquet file before Parquet.Net reads it:
/// Parquet.Net 6 follows damaged Thrift list sizes without checking them against the bytes
/// present and can spin for hours on one flipped footer byte.
/// </summary>
/// <remarks>
/// Layout from the Apache Parquet format specification ("File format"): the file ends with the
/// Thrift FileMetaData, its length as a 4-byte little-endian integer, and the magic "PAR1".
/// Page headers are Thrift too, but the fuzz test never found Parquet.Net stuck on one, so they
/// are left to it rather than read twice.
/// </remarks>
internal static class ParquetLayoutCheck
{
    private const int MagicLength = 4;
    private const int FooterTailLength = 8;

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
        if (ThriftCompactCheck.StructLength(metadata) < 0)
            throw Damaged(path, "its file metadata (the footer) is not well-formed");
        stream.Position = 0;
    }

    private static PanelInputException Damaged(string path, string problem) =>
        PanelInputException.At(path, null, null, $"starts like Parquet but cannot be read: {problem}.",
            "The file is probably truncated or damaged; write it again (and check the copy finished).");
}
