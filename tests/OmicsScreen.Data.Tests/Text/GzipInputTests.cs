using System.Buffers.Binary;
using System.IO.Compression;
using System.IO.Hashing;
using System.Text;
using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>gzip-compressed text is read directly, found by its content, and a damaged or truncated file is named.</summary>
public class GzipInputTests
{
    private const string Panel = "id,status,a,b\ns1,x,1.5,2\ns2,y,3,<0.5\ns3,y,5,NA\ns4,x,7,8\n";

    private static PanelLoadOptions Options(string path) => new() { MatrixPath = path, OutcomeColumn = "status" };

    [Fact]
    public void A_gzip_file_loads_like_its_plain_text_whatever_its_name()
    {
        using var folder = new TempFolder();
        string plain = folder.File("panel.csv", Panel);
        // A name with no .gz: the format is told by the magic bytes 1F 8B (RFC 1952, section 2.3.1), not the name.
        string zipped = folder.File("panel.data");
        File.WriteAllBytes(zipped, GzipFile.Compress(Encoding.UTF8.GetBytes(Panel)));

        var expected = PanelLoader.Load(Options(plain));
        var loaded = PanelLoader.Load(Options(zipped));

        PanelAssert.Identical(expected.Panel, loaded.Panel);
        Assert.Equal("gzip", loaded.Inspection.Compression);
        Assert.Null(expected.Inspection.Compression);
    }

    [Fact]
    public void A_truncated_gzip_file_is_refused_naming_the_file_not_loaded_short()
    {
        using var folder = new TempFolder();
        var rows = new StringBuilder("id,status,a\n");
        for (int s = 0; s < 5000; s++) rows.Append(FormattableString.Invariant($"s{s},{(s % 2 == 0 ? "x" : "y")},{s * 0.37}\n"));
        var whole = GzipFile.Compress(Encoding.UTF8.GetBytes(rows.ToString()));
        // A cut inside the data and a cut inside the 8-byte trailer (CRC-32, ISIZE; RFC 1952, 2.3.1):
        // .NET's GZipStream reads both without complaint, so the reader must check the trailer itself.
        foreach (int cut in new[] { whole.Length / 2, whole.Length - 3 })
        {
            string path = folder.File($"cut{cut}.csv.gz");
            File.WriteAllBytes(path, whole[..cut]);

            var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));

            Assert.StartsWith($"cut{cut}.csv.gz: ", error.Message);
            Assert.Contains("truncated", error.Message);
            Assert.Contains("gzip -t", error.Message);
        }
    }

    [Fact]
    public void A_gzip_file_with_damaged_data_is_refused_naming_the_file()
    {
        using var folder = new TempFolder();
        var whole = GzipFile.Compress(Encoding.UTF8.GetBytes(string.Concat(Enumerable.Repeat(Panel, 200))));
        // The data bytes changed, the trailer kept: the CRC-32 of the output no longer matches (RFC 1952, 2.3.1 and 8).
        for (int i = 20; i < whole.Length - 20; i += 7) whole[i] ^= 0x5A;
        string path = folder.File("damaged.csv.gz");
        File.WriteAllBytes(path, whole);

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));

        Assert.StartsWith("damaged.csv.gz: ", error.Message);
        Assert.Contains("gzip", error.Message);
    }

    [Fact]
    public void A_bgzip_file_of_several_members_loads_and_one_without_its_end_block_is_refused()
    {
        using var folder = new TempFolder();
        string plain = folder.File("panel.csv", Panel);
        var text = Encoding.UTF8.GetBytes(Panel);
        var members = new List<byte>();
        // BGZF: each block a gzip member with the BC extra field, then a fixed empty end block (SAM/BAM specification, section 4.1).
        for (int start = 0; start < text.Length; start += 20) members.AddRange(BgzfBlock(text.AsSpan(start, Math.Min(20, text.Length - start))));
        // The end block as the specification prints it (section 4.1.2): an empty member whose deflate data are 03 00.
        byte[] endBlock = [0x1F, 0x8B, 0x08, 0x04, 0, 0, 0, 0, 0, 0xFF, 0x06, 0, 0x42, 0x43, 0x02, 0, 0x1B, 0, 0x03, 0, 0, 0, 0, 0, 0, 0, 0, 0];
        string whole = folder.File("panel.csv.bgz");
        File.WriteAllBytes(whole, [.. members, .. endBlock]);
        string cut = folder.File("cut.csv.bgz");
        File.WriteAllBytes(cut, [.. members]);

        PanelAssert.Identical(PanelLoader.Load(Options(plain)).Panel, PanelLoader.Load(Options(whole)).Panel);
        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(cut)));
        Assert.Contains("end-of-file block", error.Message);
    }

    [Fact]
    public void Gzip_holding_a_Parquet_file_is_named_with_the_fix()
    {
        using var folder = new TempFolder();
        string path = folder.File("panel.parquet.gz");
        File.WriteAllBytes(path, GzipFile.Compress([.. "PAR1"u8, 1, 2, 3, 0, 0]));

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));

        Assert.Contains("gzip-compressed Parquet or Arrow", error.Message);
    }

    /// <summary>One BGZF block: gzip header with FEXTRA holding BC (block size - 1), raw deflate data, CRC-32, ISIZE.</summary>
    private static byte[] BgzfBlock(ReadOnlySpan<byte> data)
    {
        var deflated = new MemoryStream();
        using (var deflate = new DeflateStream(deflated, CompressionLevel.Optimal, leaveOpen: true)) deflate.Write(data);
        var body = deflated.ToArray();
        int blockSize = 18 + body.Length + 8;
        var block = new byte[blockSize];
        byte[] header = [0x1F, 0x8B, 0x08, 0x04, 0, 0, 0, 0, 0, 0xFF, 0x06, 0x00, (byte)'B', (byte)'C', 0x02, 0x00];
        header.CopyTo(block, 0);
        BinaryPrimitives.WriteUInt16LittleEndian(block.AsSpan(16), (ushort)(blockSize - 1));
        body.CopyTo(block, 18);
        BinaryPrimitives.WriteUInt32LittleEndian(block.AsSpan(18 + body.Length), Crc32.HashToUInt32(data));
        BinaryPrimitives.WriteUInt32LittleEndian(block.AsSpan(22 + body.Length), (uint)data.Length);
        return block;
    }
}
