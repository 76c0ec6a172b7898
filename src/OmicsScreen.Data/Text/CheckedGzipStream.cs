using System.Buffers.Binary;
using System.IO.Compression;
using System.IO.Hashing;

namespace OmicsScreen.Data.Text;

/// <summary>
/// Decompresses a gzip file and, at its end, checks the member trailer, because .NET's
/// <see cref="GZipStream"/> ends silently on a truncated file (a download cut short would
/// otherwise load as a shorter matrix, or fail on a ragged last row with a misleading message).
/// </summary>
/// <remarks>
/// Each gzip member ends with the CRC-32 and the length modulo 2^32 of its uncompressed data
/// (RFC 1952, section 2.3.1). A file written by gzip is one member, so the trailer in its last
/// 8 bytes must match everything decompressed. A BGZF file (bgzip; SAM/BAM format specification,
/// section 4.1) is many members and ends with a fixed 28-byte empty member, which is checked
/// instead. Files made by joining several gzip files are not told apart from damaged ones and
/// are refused with that said.
/// </remarks>
internal sealed class CheckedGzipStream : Stream
{
    /// <summary>The BGZF end-of-file marker: an empty member with the BC extra field (SAM/BAM specification, section 4.1.2).</summary>
    private static readonly byte[] BgzfEndOfFile =
    [
        0x1F, 0x8B, 0x08, 0x04, 0x00, 0x00, 0x00, 0x00, 0x00, 0xFF, 0x06, 0x00, 0x42, 0x43,
        0x02, 0x00, 0x1B, 0x00, 0x03, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00,
    ];

    private readonly FileStream _file;
    private readonly GZipStream _gzip;
    private readonly string _path;
    private readonly Crc32 _crc = new();
    private long _length;
    private bool _checked;

    public CheckedGzipStream(FileStream file, string path)
    {
        _file = file;
        _path = path;
        _gzip = new GZipStream(file, CompressionMode.Decompress, leaveOpen: false);
    }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        int read;
        try
        {
            read = _gzip.Read(buffer);
        }
        catch (InvalidDataException e)
        {
            throw Damaged($"is gzip-compressed but damaged ({e.Message}).", e);
        }
        if (read > 0)
        {
            _crc.Append(buffer[..read]);
            _length += read;
        }
        else if (buffer.Length > 0 && !_checked)
        {
            _checked = true;
            CheckTrailer();
        }
        return read;
    }

    private void CheckTrailer()
    {
        long size = new FileInfo(_path).Length;
        using var file = new FileStream(_path, FileMode.Open, FileAccess.Read, FileShare.Read, 1);
        Span<byte> head = stackalloc byte[16];
        int headLength = file.ReadAtLeast(head, head.Length, throwOnEndOfStream: false);
        bool bgzf = headLength >= 14 && (head[3] & 0x04) != 0 && head[12] == (byte)'B' && head[13] == (byte)'C';
        if (bgzf)
        {
            Span<byte> tail = stackalloc byte[BgzfEndOfFile.Length];
            file.Seek(Math.Max(0, size - tail.Length), SeekOrigin.Begin);
            int tailLength = file.ReadAtLeast(tail, tail.Length, throwOnEndOfStream: false);
            if (tailLength != tail.Length || !tail.SequenceEqual(BgzfEndOfFile))
                throw Damaged("is BGZF-compressed (bgzip) but lacks the end-of-file block: it is truncated (a download or copy cut short).", null);
            return;
        }
        Span<byte> trailer = stackalloc byte[8];
        file.Seek(Math.Max(0, size - 8), SeekOrigin.Begin);
        if (size < 18 || file.ReadAtLeast(trailer, 8, throwOnEndOfStream: false) != 8)
            throw Damaged("is gzip-compressed but too short to hold a whole gzip file: it is truncated.", null);
        uint crc = BinaryPrimitives.ReadUInt32LittleEndian(trailer);
        uint length = BinaryPrimitives.ReadUInt32LittleEndian(trailer[4..]);
        if (crc != _crc.GetCurrentHashAsUInt32() || length != (uint)_length)
            throw Damaged("is gzip-compressed but its data do not match the gzip trailer (CRC-32 and length): the file is truncated or damaged, or several .gz files were joined into one.", null);
    }

    private PanelInputException Damaged(string problem, Exception? inner) =>
        PanelInputException.At(_path, null, null, problem,
            "Download or copy the file again and check it with `gzip -t`; a file made by joining several .gz files must be decompressed and compressed again as one.",
            inner);

    protected override void Dispose(bool disposing)
    {
        if (disposing) _gzip.Dispose();
        base.Dispose(disposing);
    }

    public override bool CanRead => true;
    public override bool CanSeek => false;
    public override bool CanWrite => false;
    public override long Length => throw new NotSupportedException();
    public override long Position { get => _length; set => throw new NotSupportedException(); }
    public override void Flush() { }
    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();
    public override void SetLength(long value) => throw new NotSupportedException();
    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();
}
