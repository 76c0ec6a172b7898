using System.Buffers.Binary;
using Apache.Arrow.Ipc;

namespace OmicsScreen.Data.Sizing;

/// <summary>
/// Reads an Arrow IPC file's or stream's column names and total row count from metadata alone:
/// the schema, then each message's flatbuffer header, seeking past every message body.
/// </summary>
/// <remarks>
/// Apache Arrow columnar format specification, "Serialization and Interprocess Communication":
/// a stream is a sequence of encapsulated messages, each the continuation marker 0xFFFFFFFF
/// (absent before format version 0.15), an int32 metadata length (0 ends the stream), a
/// flatbuffer Message (Message.fbs: version, header_type, header, bodyLength), then bodyLength
/// bytes of body. A file is "ARROW1" and two padding bytes, the same stream, a footer, its int32
/// length and "ARROW1" again. A RecordBatch header (header_type 3) has its row count in field 0.
/// </remarks>
internal static class ArrowRowCounter
{
    private const byte RecordBatchHeader = 3;
    private const int FileMagicWithPadding = 8;
    private const int FileTrailer = 4 + 6;
    private const int MessageHeaderTypeField = 1;
    private const int MessageHeaderField = 2;
    private const int MessageBodyLengthField = 3;
    private const int RecordBatchLengthField = 0;

    public static IReadOnlyList<string> ColumnNames(string path, MatrixFileFormat format)
    {
        using var stream = File.OpenRead(path);
        using ArrowStreamReader reader = format == MatrixFileFormat.ArrowFile
            ? new ArrowFileReader(stream, leaveOpen: true)
            : new ArrowStreamReader(stream, leaveOpen: true);
        var fields = reader.Schema.FieldsList;
        var names = new string[fields.Count];
        for (int c = 0; c < names.Length; c++) names[c] = fields[c].Name.Trim();
        return names;
    }

    public static long CountRows(string path, MatrixFileFormat format)
    {
        using var stream = File.OpenRead(path);
        long position = 0, end = stream.Length;
        if (format == MatrixFileFormat.ArrowFile)
        {
            position = FileMagicWithPadding;
            end = FooterStart(stream);
        }
        Span<byte> word = stackalloc byte[4];
        long rows = 0;
        // Invariant: position is the start of a message (or of the end-of-stream marker); rows counts every batch before it.
        while (position + 4 <= end)
        {
            stream.Position = position;
            int length = ReadInt32(stream, word);
            position += 4;
            if (length == -1)
            {
                if (position + 4 > end) break;
                length = ReadInt32(stream, word);
                position += 4;
            }
            if (length == 0) break;
            if (length < 0 || position + length > end) throw new InvalidDataException("An Arrow message runs past the end of the data.");
            var metadata = new byte[length];
            stream.ReadExactly(metadata);
            position += length;
            var (headerType, header, bodyLength) = ReadMessage(metadata);
            if (headerType == RecordBatchHeader) rows += ReadInt64Field(metadata, header, RecordBatchLengthField);
            if (bodyLength < 0) throw new InvalidDataException("An Arrow message has a negative body length.");
            position += bodyLength;
        }
        return rows;
    }

    /// <summary>Where the footer begins: the trailer is the footer's int32 length and "ARROW1".</summary>
    private static long FooterStart(FileStream stream)
    {
        if (stream.Length < FileMagicWithPadding + FileTrailer) throw new InvalidDataException("Too short for an Arrow file.");
        Span<byte> word = stackalloc byte[4];
        stream.Position = stream.Length - FileTrailer;
        int footerLength = ReadInt32(stream, word);
        long start = stream.Length - FileTrailer - footerLength;
        if (footerLength < 0 || start < FileMagicWithPadding) throw new InvalidDataException("The Arrow footer length is out of range.");
        return start;
    }

    private static (byte HeaderType, int Header, long BodyLength) ReadMessage(byte[] metadata)
    {
        int message = checked((int)BinaryPrimitives.ReadUInt32LittleEndian(metadata));
        int typeAt = FieldPosition(metadata, message, MessageHeaderTypeField);
        byte headerType = typeAt == 0 ? (byte)0 : metadata[typeAt];
        int headerAt = FieldPosition(metadata, message, MessageHeaderField);
        int header = headerAt == 0 ? 0 : checked(headerAt + (int)BinaryPrimitives.ReadUInt32LittleEndian(metadata.AsSpan(headerAt)));
        int bodyAt = FieldPosition(metadata, message, MessageBodyLengthField);
        long bodyLength = bodyAt == 0 ? 0 : BinaryPrimitives.ReadInt64LittleEndian(metadata.AsSpan(bodyAt));
        return (headerType, header, bodyLength);
    }

    private static long ReadInt64Field(byte[] metadata, int table, int field)
    {
        if (table == 0) return 0;
        int at = FieldPosition(metadata, table, field);
        return at == 0 ? 0 : BinaryPrimitives.ReadInt64LittleEndian(metadata.AsSpan(at));
    }

    /// <summary>
    /// The absolute position of a table's field, or 0 when the field is absent (its default).
    /// FlatBuffers: a table starts with an int32 offset back to its vtable; the vtable holds its
    /// own byte size, the table's, then one uint16 offset per field, 0 for an absent field.
    /// </summary>
    private static int FieldPosition(byte[] buffer, int table, int field)
    {
        int vtable = checked(table - BinaryPrimitives.ReadInt32LittleEndian(buffer.AsSpan(table)));
        int vtableSize = BinaryPrimitives.ReadUInt16LittleEndian(buffer.AsSpan(vtable));
        int entry = 4 + 2 * field;
        if (entry + 2 > vtableSize) return 0;
        int offset = BinaryPrimitives.ReadUInt16LittleEndian(buffer.AsSpan(vtable + entry));
        return offset == 0 ? 0 : table + offset;
    }

    private static int ReadInt32(Stream stream, Span<byte> word)
    {
        stream.ReadExactly(word);
        return BinaryPrimitives.ReadInt32LittleEndian(word);
    }
}
