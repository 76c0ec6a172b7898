using OmicsScreen.Data;
using OmicsScreen.Data.Output;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Runs.Output;

namespace OmicsScreen.Runs.Results;

/// <summary>
/// A folder of results, held by one run at a time: refuses to write among someone else's files
/// or another verb's results, refuses before any work when one of its output names is taken by
/// something that is not a file of an earlier run (a FIFO, a device, a link, an input of this
/// run), removes its own earlier outputs before writing so a folder never mixes two runs, writes
/// every file atomically, and writes the manifest last so a folder with a manifest is complete.
/// A refused run changes nothing in the folder.
/// </summary>
public sealed class ResultsFolder : IDisposable
{
    public const string ManifestFileName = "manifest.json";

    /// <summary>Text every manifest of ours starts with; how a folder is recognised as ours.</summary>
    public const string ManifestMarker = "\"tool\": \"" + ManifestTool.Name + "\"";

    /// <summary>How an apply manifest tells itself from a screen's.</summary>
    private const string ApplyMarker = "\"command\": \"" + ApplyManifest.CommandName + "\"";

    private readonly ResultsFolderLock _lock;
    private readonly bool _created;

    private ResultsFolder(string path, ResultsKind kind, ResultsFolderLock held, bool created)
    {
        Path = path;
        Kind = kind;
        _lock = held;
        _created = created;
    }

    public string Path { get; }

    public ResultsKind Kind { get; }

    public List<string> WrittenFiles { get; } = [];

    /// <summary>The files a screen reads (matrix, sample sheet, feature sheet), which its outputs must never replace.</summary>
    public static IEnumerable<string?> InputPaths(PanelLoadOptions panel) => [panel.MatrixPath, panel.SampleSheetPath, panel.FeatureSheetPath];

    /// <summary>
    /// Checks the folder and takes its lock; nothing in it is changed yet (see
    /// <see cref="ClearEarlierOutputs"/>). <paramref name="inputPaths"/> are the run's input files,
    /// which the run must never replace or remove.
    /// </summary>
    public static ResultsFolder Open(string path, bool force, ResultsKind kind, IEnumerable<string?> inputPaths, TextWriter notes)
    {
        string full = System.IO.Path.GetFullPath(path);
        var folderKind = FileKinds.Of(full);
        if (folderKind is not (FileKind.Absent or FileKind.Directory or FileKind.SymbolicLink) || (folderKind == FileKind.SymbolicLink && !Directory.Exists(full)))
            throw new RunRefusedException($"{path} is {FileKinds.Describe(folderKind)}; give --out a folder.", RunRefusal.Output);
        bool created = !Directory.Exists(full);
        Directory.CreateDirectory(full);
        ResultsFolderLock? held = null;
        try
        {
            held = ResultsFolderLock.Acquire(full, path, notes);
            Check(path, full, force, kind, inputPaths);
            return new ResultsFolder(full, kind, held, created);
        }
        catch
        {
            held?.Dispose();
            if (created) TryRemoveEmpty(full);
            throw;
        }
    }

    /// <summary>
    /// Removes this verb's earlier outputs (the manifest first, so the folder never looks complete
    /// meanwhile) and the temporary files a killed run left while writing them. Only this verb's
    /// own file names are touched; anything else in the folder is left as it is.
    /// </summary>
    public void ClearEarlierOutputs()
    {
        Delete(System.IO.Path.Combine(Path, ManifestFileName));
        foreach (var name in OutputNames(Kind)) Delete(System.IO.Path.Combine(Path, name));
        foreach (var file in Directory.EnumerateFiles(Path, ".*.partial"))
            if (IsOurTemporary(System.IO.Path.GetFileName(file))) Delete(file);
    }

    public void WriteText(string fileName, Action<TextWriter> write)
    {
        AtomicFile.WriteText(System.IO.Path.Combine(Path, fileName), write);
        WrittenFiles.Add(fileName);
    }

    /// <summary>Lets the folder go; a folder this run created and left empty (a run stopped early) is removed.</summary>
    public void Dispose()
    {
        _lock.Dispose();
        if (_created) TryRemoveEmpty(Path);
    }

    /// <summary>The files a verb writes into its folder, the manifest aside.</summary>
    public static IReadOnlyList<string> OutputNames(ResultsKind kind) => kind == ResultsKind.Apply
        ? [ApplyResultFiles.Scores, ApplyResultFiles.Evaluation, ApplyResultFiles.Calibration, ApplyResultFiles.Confusion, ApplyResultFiles.RiskGroups, ApplyResultFiles.Report]
        :
        [
            "shortlist.tsv", "features.tsv", "panel_size_curve.tsv", Reporting.Screen.EffectTables.FileName, "marker_statistics.tsv",
            "marker_statistics_by_cohort.tsv", .. ScreenResultFiles.CohortTables, Reporting.Screen.AddedValueTables.FileName,
            Reporting.Screen.CovariateTrackingTables.FileName, Locking.LockedPanelFile.DefaultFileName, ScreenResultFiles.Report,
        ];

    private static void Check(string shown, string full, bool force, ResultsKind kind, IEnumerable<string?> inputPaths)
    {
        string checkpoint = System.IO.Path.Combine(full, ScreenResultFiles.CheckpointFolder);
        var other = kind == ResultsKind.Apply ? ResultsKind.Screen : ResultsKind.Apply;
        if (IsResultsOf(full, other))
            throw new RunRefusedException(
                $"{shown} holds the results of `{Verb(other)}` (its {ManifestFileName} records them); `{Verb(kind)}` writes into a folder of its own, "
                + "so choose another --out folder. Its files were left as they are.",
                RunRefusal.Output);
        if (HasEntries(full) && !force && !IsResultsOf(full, kind))
            throw new RunRefusedException(
                $"{shown} is not empty and holds no results of an earlier {Verb(kind)}; choose an empty folder, or pass --force to write into it anyway.",
                RunRefusal.Output);

        var inputs = new HashSet<string>(StringComparer.Ordinal);
        foreach (var input in inputPaths)
            if (!string.IsNullOrEmpty(input)) inputs.Add(System.IO.Path.GetFullPath(input));
        foreach (var name in OutputNames(kind).Append(ManifestFileName))
        {
            string target = System.IO.Path.Combine(full, name);
            if (inputs.Contains(target))
                throw new RunRefusedException(
                    $"{System.IO.Path.Combine(shown, name)} is an input of this run, and the run would replace it; move the input out of the results folder, or choose another --out folder.",
                    RunRefusal.Output);
            var targetKind = FileKinds.Of(target);
            if (targetKind is not (FileKind.Absent or FileKind.RegularFile))
                throw new RunRefusedException(
                    $"{System.IO.Path.Combine(shown, name)} is {FileKinds.Describe(targetKind)}, not a file of an earlier run, and the run would replace it; "
                    + "remove it, or choose another --out folder.",
                    RunRefusal.Output);
        }
        if (kind == ResultsKind.Screen)
        {
            var checkpointKind = FileKinds.Of(checkpoint);
            if (checkpointKind is not (FileKind.Absent or FileKind.Directory))
                throw new RunRefusedException(
                    $"{System.IO.Path.Combine(shown, ScreenResultFiles.CheckpointFolder)} is {FileKinds.Describe(checkpointKind)}, not the checkpoint folder of an earlier run; "
                    + "remove it, or choose another --out folder.",
                    RunRefusal.Output);
            foreach (var input in inputs)
                if (input.StartsWith(checkpoint + System.IO.Path.DirectorySeparatorChar, StringComparison.Ordinal))
                    throw new RunRefusedException(
                        $"{input} is an input of this run inside the checkpoint folder, which the run replaces; move it out of {shown}.",
                        RunRefusal.Output);
        }
    }

    private static string Verb(ResultsKind kind) => kind == ResultsKind.Apply ? "apply" : "screen";

    /// <summary>Entries other than the lock's own files.</summary>
    private static bool HasEntries(string folder) =>
        Directory.EnumerateFileSystemEntries(folder).Any(e => !ResultsFolderLock.IsLockFile(System.IO.Path.GetFileName(e)));

    /// <summary>
    /// A folder holds a verb's results when it holds that verb's manifest, or (for a screen) the
    /// checkpoint of a run that has not finished.
    /// </summary>
    private static bool IsResultsOf(string folder, ResultsKind kind)
    {
        string? manifest = ReadSmall(System.IO.Path.Combine(folder, ManifestFileName));
        if (manifest is not null && manifest.Contains(ManifestMarker, StringComparison.Ordinal))
            return manifest.Contains(ApplyMarker, StringComparison.Ordinal) == (kind == ResultsKind.Apply);
        if (kind == ResultsKind.Apply) return false;
        string? record = ReadSmall(System.IO.Path.Combine(folder, ScreenResultFiles.CheckpointFolder, ScreenResultFiles.CheckpointRecord));
        return record is not null && record.Contains(ManifestMarker, StringComparison.Ordinal);
    }

    /// <summary>A regular file's text when it is small enough to be one of our records; a FIFO is never opened.</summary>
    private static string? ReadSmall(string file)
    {
        if (FileKinds.Of(file) != FileKind.RegularFile) return null;
        // Our records are small; a large file of that name is not one of ours.
        if (new FileInfo(file).Length > 4 << 20) return null;
        return File.ReadAllText(file);
    }

    /// <summary>A temporary file <see cref="AtomicFile"/> names after one of this verb's outputs: ".NAME.PID.GUID.partial".</summary>
    private bool IsOurTemporary(string fileName)
    {
        foreach (var name in OutputNames(Kind).Append(ManifestFileName))
            if (fileName.StartsWith("." + name + ".", StringComparison.Ordinal)) return true;
        return false;
    }

    private static void Delete(string file)
    {
        if (FileKinds.Of(file) == FileKind.RegularFile) File.Delete(file);
    }

    private static void TryRemoveEmpty(string folder)
    {
        try
        {
            if (Directory.Exists(folder) && !Directory.EnumerateFileSystemEntries(folder).Any()) Directory.Delete(folder);
        }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
    }
}
