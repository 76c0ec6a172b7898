using OmicsScreen.Data.Columnar;

namespace OmicsScreen.Data.Tests.Columnar;

/// <summary>
/// The Thrift compact-protocol walker measures well-formed structs exactly and refuses every size
/// the bytes cannot hold. Byte sequences are hand-encoded from the Apache Thrift compact
/// protocol specification (doc/specs/thrift-compact-protocol.md).
/// </summary>
public sealed class ThriftCompactCheckTests
{
    [Fact]
    public void Well_formed_struct_of_every_value_kind_is_measured_exactly()
    {
        byte[] bytes =
        [
            0x15, 0x54,                   // field 1, i32, zigzag 0x54 = 42
            0x11,                         // field 2, boolean true (value in the type)
            0x16, 0x03,                   // field 3, i64, zigzag 3 = -2
            0x18, 0x03, 0x61, 0x62, 0x63, // field 4, binary "abc"
            0x19, 0x35, 0x02, 0x04, 0x06, // field 5, list of three i32: 1, 2, 3
            0x1B, 0x01, 0x85, 0x01, 0x61, 0x02, // field 6, map of one binary -> i32: "a" -> 1
            0x1C, 0x13, 0x01, 0x00,       // field 7, struct { field 1: i8 = 1 }
            0x00,                         // stop
            0xEE, 0xEE,                   // bytes after the struct are not part of it
        ];
        int length = ThriftCompactCheck.StructLength(bytes);

        Assert.Equal(bytes.Length - 2, length);
    }

    [Fact]
    public void Long_field_id_form_is_read()
    {
        // Delta 0 means the field id follows as a zigzag varint: id 100 is zigzag 200 = 0xC8 0x01.
        byte[] bytes = [0x05, 0xC8, 0x01, 0x0E, 0x00];

        Assert.Equal(bytes.Length, ThriftCompactCheck.StructLength(bytes));
    }

    [Theory]
    [InlineData(new byte[] { 0x19, 0xFC, 0xFF, 0xFF, 0xFF, 0xFF, 0x07, 0x00 })] // list claiming 2^31 - 1 structs
    [InlineData(new byte[] { 0x18, 0x7F, 0x61, 0x00 })]                          // binary of 127 bytes, 1 present
    [InlineData(new byte[] { 0x1B, 0xFF, 0x01, 0x55, 0x00 })]                    // map of 255 entries
    [InlineData(new byte[] { 0x15, 0x80, 0x80 })]                                // varint running off the end
    [InlineData(new byte[] { 0x15, 0x02 })]                                      // no stop byte
    [InlineData(new byte[] { 0x1F, 0x00 })]                                      // type 15 does not exist
    public void Sizes_and_values_the_bytes_cannot_hold_are_refused(byte[] bytes)
    {
        Assert.Equal(-1, ThriftCompactCheck.StructLength(bytes));
    }

    [Fact]
    public void Nesting_deeper_than_the_cap_is_refused()
    {
        // 100 nested structs, each "field 1: struct", then the stops.
        var bytes = new List<byte>();
        for (int depth = 0; depth < 100; depth++) bytes.Add(0x1C);
        for (int depth = 0; depth <= 100; depth++) bytes.Add(0x00);

        Assert.Equal(-1, ThriftCompactCheck.StructLength(bytes.ToArray()));
    }
}
