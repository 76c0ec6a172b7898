using System.Text;

namespace OmicsScreen.Data.Output;

/// <summary>
/// Writes a file under a temporary name in the same folder and renames it into place, so a
/// reader never sees a half-written result, even if the process is killed mid-write.
/// </summary>
public static class AtomicFile
{
    private static readonly UTF8Encoding Utf8NoBom = new(encoderShouldEmitUTF8Identifier: false);

    public static void WriteAllText(string path, string contents) =>
        Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, Utf8NoBom, leaveOpen: true);
            writer.Write(contents);
        });

    /// <summary>Writes text through a writer; lines end in LF whatever the platform.</summary>
    public static void WriteText(string path, Action<TextWriter> write) =>
        Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, Utf8NoBom, bufferSize: 1 << 16, leaveOpen: true) { NewLine = "\n" };
            write(writer);
        });

    public static void Write(string path, Action<Stream> write)
    {
        string full = Path.GetFullPath(path);
        string folder = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(folder);
        string temporary = Path.Combine(folder, $".{Path.GetFileName(full)}.{Environment.ProcessId}.{Guid.NewGuid():N}.partial");
        try
        {
            using (var stream = new FileStream(temporary, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }
            File.Move(temporary, full, overwrite: true);
        }
        catch
        {
            TryDelete(temporary);
            throw;
        }
    }

    private static void TryDelete(string path)
    {
        try { File.Delete(path); }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
    }
}
