using OmicsScreen.Data.Output;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// A folder of results: refuses to write among someone else's files, writes every file
/// atomically, and writes the manifest last so a folder with a manifest is a complete one.
/// </summary>
internal sealed class ResultsFolder
{
    public const string ManifestFileName = "manifest.json";

    /// <summary>Text every manifest of ours starts with; how a folder is recognised as ours.</summary>
    public const string ManifestMarker = "\"tool\": \"omicsscreen\"";

    private ResultsFolder(string path) => Path = path;

    public string Path { get; }

    public List<string> WrittenFiles { get; } = [];

    public static ResultsFolder Prepare(string path, bool force)
    {
        string full = System.IO.Path.GetFullPath(path);
        if (File.Exists(full))
            throw new CommandInputException($"{path} is a file; give --out a folder.", ExitCode.OutputError);
        if (Directory.Exists(full) && Directory.EnumerateFileSystemEntries(full).Any() && !force && !IsOurs(full))
            throw new CommandInputException(
                $"{path} is not empty and holds no results of an earlier screen; choose an empty folder, or pass --force to write into it anyway.",
                ExitCode.OutputError);
        Directory.CreateDirectory(full);
        // A new run's manifest replaces the old one last; until then the folder must not look complete.
        string manifest = System.IO.Path.Combine(full, ManifestFileName);
        if (File.Exists(manifest)) File.Delete(manifest);
        return new ResultsFolder(full);
    }

    public void WriteText(string fileName, Action<TextWriter> write)
    {
        AtomicFile.WriteText(System.IO.Path.Combine(Path, fileName), write);
        WrittenFiles.Add(fileName);
    }

    /// <summary>A folder is ours when it holds our manifest, or the checkpoint of a run that has not finished.</summary>
    private static bool IsOurs(string folder) =>
        HasMarker(System.IO.Path.Combine(folder, ManifestFileName))
        || HasMarker(System.IO.Path.Combine(folder, ScreenRun.CheckpointFolderName, ScreenRun.CheckpointRecordName));

    private static bool HasMarker(string file)
    {
        if (!File.Exists(file)) return false;
        // Our records are small; a large file of that name is not one of ours.
        if (new FileInfo(file).Length > 4 << 20) return false;
        return File.ReadAllText(file).Contains(ManifestMarker, StringComparison.Ordinal);
    }
}
