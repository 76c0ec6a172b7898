namespace OmicsScreen.Data.Columnar;

/// <summary>
/// Measures one Thrift compact-protocol struct in a byte span, with every size checked against
/// the bytes that remain, so that damaged Parquet metadata is found before a Thrift reader
/// without such checks loops over a list of a billion phantom elements.
/// </summary>
/// <remarks>
/// Encoding from the Apache Thrift compact protocol specification
/// (doc/specs/thrift-compact-protocol.md): a field header byte holds the field-id delta in its
/// high nibble (0: a zigzag varint id follows) and the type in its low nibble; a zero byte ends
/// a struct; integers are zigzag varints; binary is a varint length then the bytes; a list or set
/// header holds its size in the high nibble (15: a varint size follows) and the element type in
/// the low nibble; a map is a varint size, then (if not empty) one byte of key and value types.
/// Every element of a collection takes at least one byte, so a size larger than the bytes left
/// is damage; nesting is capped so that damage cannot recurse without end.
/// </remarks>
internal static class ThriftCompactCheck
{
    private const int MaxDepth = 64;
    private const int MaxVarintBytes = 10;

    private const int BooleanTrue = 1, BooleanFalse = 2, Int8 = 3, Int16 = 4, Int32 = 5, Int64 = 6, Double = 7,
        Binary = 8, List = 9, Set = 10, Map = 11, Struct = 12, Uuid = 13;

    /// <summary>
    /// The length in bytes of the struct that starts <paramref name="bytes"/>, or -1 when it is
    /// malformed or runs past the end.
    /// </summary>
    public static int StructLength(ReadOnlySpan<byte> bytes)
    {
        int position = 0;
        return SkipStruct(bytes, ref position, 0) ? position : -1;
    }

    private static bool SkipStruct(ReadOnlySpan<byte> bytes, ref int position, int depth)
    {
        if (depth > MaxDepth) return false;
        // Invariant: bytes[..position] hold complete fields of this struct.
        while (position < bytes.Length)
        {
            byte header = bytes[position++];
            if (header == 0) return true;
            int type = header & 0x0F;
            // A zero delta means the field id follows as a varint; only its length matters here.
            if (header >> 4 == 0 && !TryReadVarint(bytes, ref position, out _)) return false;
            if (!SkipValue(bytes, ref position, type, depth, inCollection: false)) return false;
        }
        return false;
    }

    private static bool SkipValue(ReadOnlySpan<byte> bytes, ref int position, int type, int depth, bool inCollection)
    {
        switch (type)
        {
            case BooleanTrue or BooleanFalse:
                // A boolean field carries its value in the type; a boolean element takes one byte.
                return !inCollection || Advance(bytes, ref position, 1);
            case Int8:
                return Advance(bytes, ref position, 1);
            case Int16 or Int32 or Int64:
                return TryReadVarint(bytes, ref position, out _);
            case Double:
                return Advance(bytes, ref position, 8);
            case Uuid:
                return Advance(bytes, ref position, 16);
            case Binary:
                return TryReadVarint(bytes, ref position, out ulong length)
                    && length <= (ulong)(bytes.Length - position) && Advance(bytes, ref position, (int)length);
            case List or Set:
                return SkipList(bytes, ref position, depth);
            case Map:
                return SkipMap(bytes, ref position, depth);
            case Struct:
                return SkipStruct(bytes, ref position, depth + 1);
            default:
                return false;
        }
    }

    private static bool SkipList(ReadOnlySpan<byte> bytes, ref int position, int depth)
    {
        if (position >= bytes.Length) return false;
        byte header = bytes[position++];
        int elementType = header & 0x0F;
        ulong size = (ulong)(header >> 4);
        if (size == 15 && !TryReadVarint(bytes, ref position, out size)) return false;
        if (size > (ulong)(bytes.Length - position)) return false;
        for (ulong i = 0; i < size; i++)
            if (!SkipValue(bytes, ref position, elementType, depth + 1, inCollection: true)) return false;
        return true;
    }

    private static bool SkipMap(ReadOnlySpan<byte> bytes, ref int position, int depth)
    {
        if (!TryReadVarint(bytes, ref position, out ulong size)) return false;
        if (size == 0) return true;
        if (position >= bytes.Length) return false;
        byte types = bytes[position++];
        if (size > (ulong)(bytes.Length - position) / 2) return false;
        for (ulong i = 0; i < size; i++)
        {
            if (!SkipValue(bytes, ref position, types >> 4, depth + 1, inCollection: true)) return false;
            if (!SkipValue(bytes, ref position, types & 0x0F, depth + 1, inCollection: true)) return false;
        }
        return true;
    }

    private static bool TryReadVarint(ReadOnlySpan<byte> bytes, ref int position, out ulong value)
    {
        value = 0;
        for (int shift = 0, count = 0; count < MaxVarintBytes && position < bytes.Length; shift += 7, count++)
        {
            byte next = bytes[position++];
            value |= (ulong)(next & 0x7F) << shift;
            if ((next & 0x80) == 0) return true;
        }
        return false;
    }

    private static bool Advance(ReadOnlySpan<byte> bytes, ref int position, int count)
    {
        if (count > bytes.Length - position) return false;
        position += count;
        return true;
    }
}
