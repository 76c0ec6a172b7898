namespace OmicsScreen.TestSupport;

/// <summary>A fresh folder for one test, deleted afterwards.</summary>
public sealed class TempFolder : IDisposable
{
    public TempFolder() => Directory.CreateDirectory(Path);

    public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "omicsscreen-tests", Guid.NewGuid().ToString("N"));

    /// <summary>The path of a file in the folder, not written.</summary>
    public string File(string name) => System.IO.Path.Combine(Path, name);

    /// <summary>Writes UTF-8 text without a byte-order mark and returns the path.</summary>
    public string File(string name, string contents)
    {
        string path = File(name);
        System.IO.File.WriteAllText(path, contents);
        return path;
    }

    public string File(string name, byte[] contents)
    {
        string path = File(name);
        System.IO.File.WriteAllBytes(path, contents);
        return path;
    }

    public void Dispose()
    {
        // A test that leaves a file open (or a child process still running) must not fail for it.
        try { if (Directory.Exists(Path)) Directory.Delete(Path, recursive: true); }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
    }
}
