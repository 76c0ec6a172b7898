using System.Buffers.Binary;
using System.Text;
using Apache.Arrow;
using Apache.Arrow.Ipc;
using Apache.Arrow.Types;
using OmicsScreen.Data.Columnar;
using OmicsScreen.Data.Tests.Fuzz;
using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Columnar;

/// <summary>
/// Damage found by the loader fuzz test, each kind pinned by a hand-made file: the load ends in
/// a <see cref="PanelInputException"/> naming the file, never in a process crash or a spin.
/// </summary>
public sealed class DamagedColumnarFileTests : IDisposable
{
    private static readonly TimeSpan TimeBound = TimeSpan.FromSeconds(10);
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Arrow_text_offsets_pointing_past_the_data_are_refused_instead_of_crashing_the_process()
    {
        string path = WriteArrowPanel("offsets.arrow");
        var bytes = File.ReadAllBytes(path);
        // The id column "s01".."s12" has the offsets 0, 3, 6, 9, ... as little-endian int32s.
        var offsets = new byte[16];
        for (int i = 0; i < 4; i++) BinaryPrimitives.WriteInt32LittleEndian(offsets.AsSpan(4 * i), 3 * i);
        int at = bytes.AsSpan().IndexOf(offsets);
        Assert.True(at > 0, "the id offsets were not found in the written file");
        BinaryPrimitives.WriteInt32LittleEndian(bytes.AsSpan(at + 4), 0x7FFF_FFF0);
        File.WriteAllBytes(path, bytes);

        var error = LoadFails(path);

        Assert.Contains("offsets.arrow", error.Message);
        Assert.Contains("cannot be decoded", error.Message);
        Assert.Equal(path, error.FilePath);
    }

    [Fact]
    public void Parquet_footer_with_a_list_longer_than_the_file_is_refused_at_once()
    {
        // FileMetaData in the Thrift compact protocol (Apache Thrift compact protocol
        // specification): version 1, a schema of one element, num_rows 0, then a row group whose
        // column chunk holds an unknown field: a list claiming 2^31 - 1 structs in a few bytes.
        byte[] metadata =
        [
            0x15, 0x02,                                           // 1: version = 1
            0x19, 0x1C, 0x48, 0x06, .. "schema"u8, 0x15, 0x00, 0x00, // 2: schema = [{4: name, 5: num_children = 0}]
            0x16, 0x00,                                           // 3: num_rows = 0
            0x19, 0x1C,                                           // 4: row_groups = [ one RowGroup:
            0x19, 0x1C,                                           //   1: columns = [ one ColumnChunk:
            0x26, 0x00,                                           //     2: file_offset = 0
            0xD9, 0xFC, 0xFF, 0xFF, 0xFF, 0xFF, 0x07,             //     15: list of 2^31 - 1 structs
            0x00, 0x00, 0x00, 0x00,
        ];
        string path = WriteParquetFooterOnly("footer.parquet", metadata);

        var error = LoadFails(path);

        Assert.Contains("footer.parquet", error.Message);
        Assert.Contains("file metadata (the footer) is not well-formed", error.Message);
    }

    [Fact]
    public void Parquet_row_group_claiming_more_rows_than_the_file_can_hold_is_refused_before_any_allocation()
    {
        // A schema with one text column "id" and one row group of no column chunks that claims
        // 1,000,000,000 rows (zigzag varint 80 A8 D6 B9 07), hand-encoded as in the test above.
        byte[] metadata =
        [
            0x15, 0x02,                                                     // 1: version = 1
            0x19, 0x2C,                                                     // 2: schema, two elements:
            0x48, 0x06, .. "schema"u8, 0x15, 0x02, 0x00,                    //   {4: name, 5: num_children = 1}
            0x15, 0x0C, 0x25, 0x02, 0x18, 0x02, .. "id"u8, 0x25, 0x00, 0x00, //   {1: BYTE_ARRAY, 3: OPTIONAL, 4: "id", 6: UTF8}
            0x16, 0x80, 0xA8, 0xD6, 0xB9, 0x07,                             // 3: num_rows
            0x19, 0x1C,                                                     // 4: row_groups, one:
            0x19, 0x0C, 0x16, 0x00, 0x16, 0x80, 0xA8, 0xD6, 0xB9, 0x07, 0x00, //   {1: no columns, 2: 0 bytes, 3: num_rows}
            0x00,
        ];
        string path = WriteParquetFooterOnly("rows.parquet", metadata);

        var error = LoadFails(path);

        Assert.Contains("rows.parquet", error.Message);
        Assert.Contains("row group 1 claims 1000000000 rows", error.Message);
    }

    [Fact]
    public void Parquet_file_cut_inside_its_footer_is_refused_as_cut_short()
    {
        string path = _folder.File("cut.parquet");
        Writing.ParquetPanelWriter.Write(SyntheticPanels.Mixed(), path, PanelLayout.SamplesInRows);
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..^3]);

        var error = LoadFails(path);

        Assert.Contains("cut.parquet", error.Message);
        Assert.Contains("does not end with the Parquet marker PAR1", error.Message);
    }

    [Fact]
    public void Arrow_allocation_longer_than_the_file_is_refused_and_a_fitting_one_is_served()
    {
        var allocator = new FileBoundedAllocator(fileLength: 4096);

        using (var fitting = allocator.Allocate(1024)) Assert.True(fitting.Memory.Length >= 1024);
        var error = Assert.Throws<InvalidDataException>(() => allocator.Allocate(1 << 30));
        Assert.Contains("the whole file has 4096", error.Message);
    }

    [Fact]
    public void A_library_message_over_several_lines_becomes_one_line_of_the_input_error()
    {
        var error = PanelInputException.At("/data/panel.arrow", null, null,
            "cannot be read: minimumLength ('-256') must be a non-negative value.\nActual value was -256.", "Write it again.");

        Assert.DoesNotContain('\n', error.Message);
        Assert.Equal("panel.arrow: cannot be read: minimumLength ('-256') must be a non-negative value. Actual value was -256. Write it again.",
            error.Message);
    }

    private static PanelInputException LoadFails(string path)
    {
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group" };
        string? slow = BoundedCall.WithinBounds(() => PanelLoader.Load(options), TimeBound, TimeSpan.FromSeconds(120), out _, out var error);
        Assert.True(slow is null, $"loading {Path.GetFileName(path)} {slow}");
        return Assert.IsType<PanelInputException>(error);
    }

    /// <summary>A Parquet file of no pages: the magic, the given file metadata, its length, the magic.</summary>
    private string WriteParquetFooterOnly(string name, byte[] metadata)
    {
        string path = _folder.File(name);
        var file = new List<byte>("PAR1"u8.ToArray());
        file.AddRange(metadata);
        file.AddRange(BitConverter.GetBytes(metadata.Length));
        file.AddRange("PAR1"u8.ToArray());
        File.WriteAllBytes(path, [.. file]);
        return path;
    }

    /// <summary>Twelve samples with text ids "s01".."s12", a text outcome and one float feature.</summary>
    private string WriteArrowPanel(string name)
    {
        var schema = new Schema.Builder()
            .Field(f => f.Name("id").DataType(StringType.Default))
            .Field(f => f.Name("group").DataType(StringType.Default))
            .Field(f => f.Name("a").DataType(FloatType.Default))
            .Build();
        var ids = new StringArray.Builder();
        var groups = new StringArray.Builder();
        var values = new FloatArray.Builder();
        for (int s = 0; s < 12; s++)
        {
            ids.Append(string.Create(System.Globalization.CultureInfo.InvariantCulture, $"s{s + 1:00}"));
            groups.Append(s % 2 == 0 ? "x" : "y");
            values.Append(s * 1.5f);
        }
        string path = _folder.File(name);
        using var stream = File.Create(path);
        using var writer = new ArrowFileWriter(stream, schema);
        using var batch = new RecordBatch(schema, [ids.Build(), groups.Build(), values.Build()], 12);
        writer.WriteRecordBatch(batch);
        writer.WriteEnd();
        return path;
    }
}
