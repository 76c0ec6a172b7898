using System.IO.Compression;

namespace OmicsScreen.Data.Tests.Support;

/// <summary>Writes a file through a plain-text writer, then replaces it by its gzip compression.</summary>
internal static class GzipFile
{
    public static void Write(string path, Action<string> writePlain)
    {
        string plain = path + ".plain";
        writePlain(plain);
        Compress(plain, path);
        File.Delete(plain);
    }

    public static void Compress(string plainPath, string gzipPath)
    {
        using var input = File.OpenRead(plainPath);
        using var output = new GZipStream(File.Create(gzipPath), CompressionLevel.Fastest);
        input.CopyTo(output);
    }

    public static byte[] Compress(byte[] plain)
    {
        var buffer = new MemoryStream();
        using (var zip = new GZipStream(buffer, CompressionLevel.Fastest)) zip.Write(plain);
        return buffer.ToArray();
    }
}
