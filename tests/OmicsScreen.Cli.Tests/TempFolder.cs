namespace OmicsScreen.Cli.Tests;

/// <summary>A folder of its own for one test, deleted afterwards.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder() => Directory.CreateDirectory(Path);

    public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "omicsscreen-cli-" + Guid.NewGuid().ToString("N"));

    public string File(string name, string contents)
    {
        string path = System.IO.Path.Combine(Path, name);
        System.IO.File.WriteAllText(path, contents);
        return path;
    }

    public string File(string name, byte[] contents)
    {
        string path = System.IO.Path.Combine(Path, name);
        System.IO.File.WriteAllBytes(path, contents);
        return path;
    }

    public void Dispose()
    {
        if (Directory.Exists(Path)) Directory.Delete(Path, recursive: true);
    }
}
