using System.Text;

namespace OmicsScreen.Runs.Output;

/// <summary>
/// Checks a single output file before any work: it is never an input of the run, never a
/// folder, link, FIFO, device or socket, and an existing file is replaced only when it is one
/// this tool wrote (its first bytes are what the tool writes there).
/// </summary>
public static class OutputPathGuard
{
    /// <param name="path">The file to be written, as the user gave it.</param>
    /// <param name="option">The option that named it, for the message (e.g. "--importance-out").</param>
    /// <param name="inputPaths">The run's inputs, which must never be replaced.</param>
    /// <param name="ourStart">The text every file of this kind written by the tool begins with.</param>
    public static void CheckFile(string path, string option, IEnumerable<string?> inputPaths, string ourStart)
    {
        string full = Path.GetFullPath(path);
        foreach (var input in inputPaths)
            if (!string.IsNullOrEmpty(input) && Path.GetFullPath(input) == full)
                throw new RunRefusedException(
                    $"{option} {path} is an input of this run; writing there would replace it. Give {option} a new file name.", RunRefusal.Output);
        var kind = FileKinds.Of(full);
        if (kind == FileKind.Absent) return;
        if (kind != FileKind.RegularFile)
            throw new RunRefusedException(
                $"{option} {path} is {FileKinds.Describe(kind)}, not a file this tool wrote; nothing was replaced. Give {option} a new file name.",
                RunRefusal.Output);
        if (!StartsWith(full, ourStart))
            throw new RunRefusedException(
                $"{option} {path} already exists and was not written by this tool; it was left as it is. Give {option} a new file name, or remove the file first.",
                RunRefusal.Output);
    }

    /// <summary>True when the file's first bytes are <paramref name="start"/> in UTF-8.</summary>
    public static bool StartsWith(string file, string start)
    {
        var expected = Encoding.UTF8.GetBytes(start);
        var read = new byte[expected.Length];
        using var stream = new FileStream(file, FileMode.Open, FileAccess.Read, FileShare.ReadWrite);
        int total = 0;
        while (total < read.Length)
        {
            int count = stream.Read(read, total, read.Length - total);
            if (count == 0) return false;
            total += count;
        }
        return read.AsSpan().SequenceEqual(expected);
    }
}
