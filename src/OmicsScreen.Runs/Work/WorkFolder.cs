using System.Diagnostics.CodeAnalysis;
using System.Text.Json;
using OmicsScreen.Data.Output;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Runs.Work;

/// <summary>
/// A folder of finished work units with a record saying whose they are: the checkpoint inside a
/// results folder, or one part of a split run. Every unit is written atomically the moment it
/// is done, so a killed process loses at most the units in flight.
/// </summary>
public sealed class WorkFolder : IWorkUnitStore
{
    public const string UnitExtension = ".unit";

    private readonly byte[] _identity;
    private readonly int _featureCount;
    private readonly int _decoyCount;
    private readonly List<string> _saved = [];

    private WorkFolder(string path, string recordPath, RunRecord record, byte[] identity, int featureCount, int decoyCount)
    {
        Path = path;
        RecordPath = recordPath;
        Record = record;
        _identity = identity;
        _featureCount = featureCount;
        _decoyCount = decoyCount;
    }

    public string Path { get; }
    public string RecordPath { get; }
    public RunRecord Record { get; private set; }

    /// <summary>Units taken from the folder instead of being computed.</summary>
    public int ReusedCount { get; private set; }

    /// <summary>Unit files found unusable (truncated, edited, another run), each with the reason; they are computed again.</summary>
    public List<string> Discarded { get; } = [];

    /// <summary>
    /// Opens the folder for this run. A record of the same run is continued only when
    /// <paramref name="resume"/> is set; a record of another run is refused with the reason,
    /// unless <paramref name="force"/> discards its units.
    /// </summary>
    /// <param name="what">"checkpoint" or "part", for messages.</param>
    public static WorkFolder Open(string path, string recordFileName, RunRecord current, byte[] identity, int featureCount,
        int decoyCount, bool resume, bool force, string what, string shownPath)
    {
        string full = System.IO.Path.GetFullPath(path);
        string recordPath = System.IO.Path.Combine(full, recordFileName);
        if (File.Exists(full))
            throw new RunRefusedException($"{shownPath} is a file; give a folder.", RunRefusal.Output);
        if (Directory.Exists(full))
        {
            var stored = TryReadRecord(recordPath, out _);
            bool sameRun = stored is not null && RunIdentity.Difference(stored, current) is null && stored.Part == current.Part
                && stored.Parts == current.Parts;
            if (stored is null && Directory.EnumerateFileSystemEntries(full).Any() && !force)
                throw new RunRefusedException(
                    $"{shownPath} is not empty and holds no {what} of OmicsScreen; choose an empty folder, or pass --force to use it anyway.",
                    RunRefusal.Output);
            if (stored is not null && !sameRun && !force)
            {
                string reason = RunIdentity.Difference(stored, current)
                    ?? $"it is part {stored.Part} of {stored.Parts}, not part {current.Part} of {current.Parts}";
                throw new RunRefusedException(
                    $"{shownPath} holds a {what} of a different run, so it cannot be continued: {reason}. "
                    + "Run with the original inputs and settings, choose another folder, or pass --force to discard it.",
                    RunRefusal.Input);
            }
            if (stored is not null && sameRun && !resume && !force && !stored.Complete)
                throw new RunRefusedException(
                    $"{shownPath} holds the unfinished {what} of this same run; add --resume to continue it, or --force to discard it and start again.",
                    RunRefusal.Output);
            if (force || !sameRun) DeleteUnits(full);
        }
        Directory.CreateDirectory(full);
        var folder = new WorkFolder(full, recordPath, current with { Complete = false, Units = [] }, identity, featureCount, decoyCount);
        AtomicFile.WriteAllText(recordPath, JsonSerializer.Serialize(folder.Record, RunIdentity.Json));
        return folder;
    }

    /// <summary>
    /// Unit files present now, for telling the user how much a resume may save; each is checked
    /// in full only when the screen asks for it (an unusable one is then computed again, with a warning).
    /// </summary>
    public int CountPresent(IEnumerable<WorkUnit> units) => units.Count(u => File.Exists(UnitPath(u)));

    public bool TryLoad(WorkUnit unit, [NotNullWhen(true)] out WorkUnitResult? result)
    {
        result = null;
        string file = UnitPath(unit);
        if (!File.Exists(file)) return false;
        result = WorkUnitCodec.Decode(File.ReadAllBytes(file), _identity, unit, _featureCount, _decoyCount, out var problem);
        if (result is null)
        {
            Discarded.Add($"{unit.Name}{UnitExtension} {problem}");
            return false;
        }
        ReusedCount++;
        return true;
    }

    public void Save(WorkUnit unit, WorkUnitResult result)
    {
        var bytes = WorkUnitCodec.Encode(_identity, unit, result);
        AtomicFile.Write(UnitPath(unit), stream => stream.Write(bytes));
        _saved.Add(unit.Name);
    }

    /// <summary>Rewrites the record as complete, listing the units; last, so a complete record means complete units.</summary>
    public void MarkComplete(IReadOnlyList<WorkUnit> units)
    {
        Record = Record with { Complete = true, Units = units.Select(u => u.Name).ToArray() };
        AtomicFile.WriteAllText(RecordPath, JsonSerializer.Serialize(Record, RunIdentity.Json));
    }

    /// <summary>Removes the folder once its units are no longer needed (the results are written).</summary>
    public void Delete()
    {
        DeleteUnits(Path);
        if (File.Exists(RecordPath)) File.Delete(RecordPath);
        if (!Directory.EnumerateFileSystemEntries(Path).Any()) Directory.Delete(Path);
    }

    public static RunRecord? TryReadRecord(string recordPath, out string? problem)
    {
        problem = null;
        if (!File.Exists(recordPath))
        {
            problem = "has no " + System.IO.Path.GetFileName(recordPath);
            return null;
        }
        try
        {
            if (new FileInfo(recordPath).Length > 16 << 20)
            {
                problem = "has a record too large to be ours";
                return null;
            }
            var record = JsonSerializer.Deserialize<RunRecord>(File.ReadAllText(recordPath), RunIdentity.Json);
            if (record is null || record.Tool != RunRecord.ToolName || record.FormatVersion != RunRecord.CurrentFormatVersion)
            {
                problem = "has a record of another tool or format version";
                return null;
            }
            return record;
        }
        catch (Exception e) when (e is JsonException or NotSupportedException or IOException or UnauthorizedAccessException)
        {
            problem = "has a record that cannot be read (" + e.Message + ")";
            return null;
        }
    }

    internal string UnitPath(WorkUnit unit) => System.IO.Path.Combine(Path, unit.Name + UnitExtension);

    private static void DeleteUnits(string folder)
    {
        if (!Directory.Exists(folder)) return;
        foreach (var file in Directory.EnumerateFiles(folder, "*" + UnitExtension)) File.Delete(file);
        // Temporary files of units that were being written when a process died.
        foreach (var file in Directory.EnumerateFiles(folder, "." + "*" + ".partial")) File.Delete(file);
    }
}
