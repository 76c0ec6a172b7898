using System.Buffers.Binary;
using System.IO.Compression;

namespace OmicsScreen.Reporting.Tests.Support;

/// <summary>
/// A minimal PNG reader for checking screenshots: 8-bit greyscale, RGB or RGBA, non-interlaced,
/// following the PNG specification (W3C, 2nd edition 2003): chunks, zlib-compressed IDAT data,
/// and the five scanline filters (None, Sub, Up, Average, Paeth).
/// </summary>
internal sealed class PngImage
{
    private static readonly byte[] Signature = [137, 80, 78, 71, 13, 10, 26, 10];

    private PngImage(int width, int height, int channels, byte[] pixels)
    {
        Width = width;
        Height = height;
        Channels = channels;
        Pixels = pixels;
    }

    public int Width { get; }

    public int Height { get; }

    public int Channels { get; }

    /// <summary>Unfiltered samples, row-major, <see cref="Channels"/> bytes per pixel.</summary>
    public byte[] Pixels { get; }

    public static PngImage Decode(byte[] file)
    {
        if (file.Length < 8 || !file.AsSpan(0, 8).SequenceEqual(Signature)) throw new InvalidDataException("Not a PNG file.");
        int width = 0, height = 0, channels = 0;
        using var compressed = new MemoryStream();
        int position = 8;
        while (position + 8 <= file.Length)
        {
            int length = BinaryPrimitives.ReadInt32BigEndian(file.AsSpan(position));
            string type = System.Text.Encoding.ASCII.GetString(file, position + 4, 4);
            var data = file.AsSpan(position + 8, length);
            if (type == "IHDR")
            {
                width = BinaryPrimitives.ReadInt32BigEndian(data);
                height = BinaryPrimitives.ReadInt32BigEndian(data[4..]);
                byte bitDepth = data[8], colourType = data[9], interlace = data[12];
                if (bitDepth != 8 || interlace != 0) throw new NotSupportedException($"PNG bit depth {bitDepth}, interlace {interlace}.");
                channels = colourType switch
                {
                    0 => 1,
                    2 => 3,
                    4 => 2,
                    6 => 4,
                    _ => throw new NotSupportedException($"PNG colour type {colourType}."),
                };
            }
            else if (type == "IDAT")
            {
                compressed.Write(data);
            }
            else if (type == "IEND")
            {
                break;
            }
            position += 12 + length; // length, type, data, CRC
        }
        compressed.Position = 0;
        using var inflater = new ZLibStream(compressed, CompressionMode.Decompress);
        using var raw = new MemoryStream();
        inflater.CopyTo(raw);
        return new PngImage(width, height, channels, Unfilter(raw.ToArray(), width, height, channels));
    }

    /// <summary>Number of distinct pixel values, counted up to <paramref name="limit"/>.</summary>
    public int DistinctColours(int limit = 1000)
    {
        var seen = new HashSet<int>();
        for (int offset = 0; offset + Channels <= Pixels.Length && seen.Count < limit; offset += Channels)
        {
            int key = 0;
            for (int c = 0; c < Math.Min(Channels, 4); c++) key = (key << 8) | Pixels[offset + c];
            seen.Add(key);
        }
        return seen.Count;
    }

    private static byte[] Unfilter(byte[] raw, int width, int height, int channels)
    {
        int stride = width * channels;
        if (raw.Length < height * (stride + 1)) throw new InvalidDataException("PNG image data is shorter than its header says.");
        var pixels = new byte[height * stride];
        for (int row = 0; row < height; row++)
        {
            byte filter = raw[row * (stride + 1)];
            var source = raw.AsSpan(row * (stride + 1) + 1, stride);
            var target = pixels.AsSpan(row * stride, stride);
            var above = row > 0 ? pixels.AsSpan((row - 1) * stride, stride) : Span<byte>.Empty;
            for (int i = 0; i < stride; i++)
            {
                int left = i >= channels ? target[i - channels] : 0;
                int up = row > 0 ? above[i] : 0;
                int upLeft = row > 0 && i >= channels ? above[i - channels] : 0;
                int predictor = filter switch
                {
                    0 => 0,
                    1 => left,
                    2 => up,
                    3 => (left + up) / 2,
                    4 => Paeth(left, up, upLeft),
                    _ => throw new InvalidDataException($"Unknown PNG filter {filter}."),
                };
                target[i] = (byte)(source[i] + predictor);
            }
        }
        return pixels;
    }

    private static int Paeth(int left, int up, int upLeft)
    {
        int estimate = left + up - upLeft;
        int toLeft = Math.Abs(estimate - left), toUp = Math.Abs(estimate - up), toUpLeft = Math.Abs(estimate - upLeft);
        if (toLeft <= toUp && toLeft <= toUpLeft) return left;
        return toUp <= toUpLeft ? up : upLeft;
    }
}
