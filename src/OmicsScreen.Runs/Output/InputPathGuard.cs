namespace OmicsScreen.Runs.Output;

/// <summary>
/// Refuses an input that is not a regular file (a FIFO, a process substitution such as
/// &lt;(zcat panel.csv.gz), a device) before anything opens it: a run reads each input more than
/// once (to size the run, detect the format, read it, record its SHA-256), and a pipe gives its
/// bytes only once, so the second reading would find it empty or wait for a writer forever.
/// </summary>
public static class InputPathGuard
{
    /// <param name="path">The input as the user gave it; null when the option was not given.</param>
    /// <param name="what">What the input is, for the message ("matrix", "sample sheet", "locked panel").</param>
    public static void Check(string? path, string what)
    {
        if (string.IsNullOrEmpty(path)) return;
        var kind = FileKinds.OfTarget(path);
        if (kind is FileKind.Absent or FileKind.RegularFile or FileKind.Directory) return;
        string shown = kind == FileKind.Fifo ? "a pipe (a FIFO, or a process substitution such as <(...))" : FileKinds.Describe(kind);
        throw new RunRefusedException(
            $"{path}: the {what} is {shown}, not a regular file. OmicsScreen reads an input more than once (to size the run, detect its format, "
            + "read it and record its SHA-256), which a pipe cannot give. Save the stream to a file first (for example: zcat panel.csv.gz > panel.csv) and give that file.",
            RunRefusal.Input);
    }
}
