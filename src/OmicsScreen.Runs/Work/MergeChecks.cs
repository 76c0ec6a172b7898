using OmicsScreen.Data;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Runs.Work;

/// <summary>
/// What a merge checks before it computes anything: that the part folders belong to one run,
/// that each of its N parts is there exactly once and complete, that the results folder is none
/// of them, and that the inputs have not changed since the parts ran.
/// </summary>
public static class MergeChecks
{
    /// <summary>Reads each part folder's record; every folder must hold a finished part.</summary>
    public static List<(string Folder, RunRecord Record)> ReadParts(IReadOnlyList<string> folders)
    {
        if (folders.Count == 0) throw new RunRefusedException("Give the part folders to merge.");
        var parts = new List<(string, RunRecord)>();
        foreach (var folder in folders)
        {
            string full = Path.GetFullPath(folder);
            if (!Directory.Exists(full))
                throw new RunRefusedException($"{folder} is not a folder; give the folders written by `screen --part I/N --out FOLDER`.", RunRefusal.Input);
            var record = WorkFolder.TryReadRecord(Path.Combine(full, ScreenResultFiles.PartRecord), out var problem);
            if (record is null || record.Kind != "part")
                throw new RunRefusedException($"{folder} is not a part of a split screen: it {problem ?? "holds a checkpoint, not a part"}.", RunRefusal.Input);
            if (!record.Complete)
                throw new RunRefusedException($"{folder} is part {record.Part} of {record.Parts}, but it did not finish; run it again (with --resume to keep its finished units), then merge.", RunRefusal.Input);
            parts.Add((full, record));
        }
        return parts;
    }

    /// <summary>The parts are of one run and one split, none twice, none missing.</summary>
    public static void CheckTogether(List<(string Folder, RunRecord Record)> parts)
    {
        var (firstFolder, first) = parts[0];
        foreach (var (folder, record) in parts.Skip(1))
        {
            if (RunIdentity.Difference(first, record) is { } reason)
                throw new RunRefusedException(
                    $"{folder} belongs to a different run than {firstFolder} ({reason}, judged against {firstFolder}); merge only the parts of one run.",
                    RunRefusal.Input);
            if (record.Parts != first.Parts)
                throw new RunRefusedException(
                    $"{folder} is a part of {record.Parts}, {firstFolder} a part of {first.Parts}; merge the parts of one split.", RunRefusal.Input);
        }
        var seen = new Dictionary<int, string>();
        foreach (var (folder, record) in parts)
        {
            if (seen.TryGetValue(record.Part, out var other))
                throw new RunRefusedException($"Part {record.Part} of {record.Parts} is given twice: {other} and {folder}.", RunRefusal.Input);
            seen[record.Part] = folder;
        }
        var missing = Enumerable.Range(1, first.Parts).Where(p => !seen.ContainsKey(p)).ToArray();
        if (missing.Length > 0)
            throw new RunRefusedException(
                $"Part{(missing.Length > 1 ? "s" : "")} {string.Join(", ", missing)} of {first.Parts} {(missing.Length > 1 ? "are" : "is")} missing; run {(missing.Length > 1 ? "them" : "it")}, then merge all {first.Parts}.",
                RunRefusal.Input);
    }

    /// <summary>The results folder must not be, or hold, one of the parts: writing it would replace what is being merged.</summary>
    public static void CheckOutsideParts(string outputFolder, List<(string Folder, RunRecord Record)> parts)
    {
        string output = Path.TrimEndingDirectorySeparator(Path.GetFullPath(outputFolder));
        foreach (var (folder, _) in parts)
        {
            string part = Path.TrimEndingDirectorySeparator(folder);
            if (part == output || part.StartsWith(output + Path.DirectorySeparatorChar, StringComparison.Ordinal)
                || output.StartsWith(part + Path.DirectorySeparatorChar, StringComparison.Ordinal))
                throw new RunRefusedException(
                    $"--out {outputFolder} is, or overlaps, the part folder {folder} being merged; give the merged results a folder of their own.",
                    RunRefusal.Output);
        }
    }

    /// <summary>Every input the parts recorded is read again with the same SHA-256.</summary>
    public static void CheckInputsUnchanged(RunRecord record, LoadedPanel loaded)
    {
        foreach (var recorded in record.Inputs)
        {
            var now = loaded.Inputs.FirstOrDefault(i => Path.GetFullPath(i.Path) == recorded.Path);
            if (now is null || now.Sha256 != recorded.Sha256)
                throw new RunRefusedException(
                    $"{recorded.Path} changed since the parts ran (SHA-256 {recorded.Sha256[..12]}... then, {(now?.Sha256[..12] ?? "absent")}... now); "
                    + "run the parts again on the current file, or restore the original.", RunRefusal.Input);
        }
    }

    /// <summary>The file of every work unit of the plan: each part must list exactly the units the plan deals it.</summary>
    public static Dictionary<string, string> UnitFiles(WorkPlan plan, List<(string Folder, RunRecord Record)> parts)
    {
        var fileOfUnit = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (folder, record) in parts)
        {
            var expected = plan.UnitsOfPart(record.Part, record.Parts).Select(u => u.Name).ToArray();
            if (!expected.SequenceEqual(record.Units))
                throw new RunRefusedException(
                    $"{folder} does not list the work units of part {record.Part} of {record.Parts}; run that part again, then merge.",
                    RunRefusal.Input);
            foreach (var name in expected) fileOfUnit[name] = Path.Combine(folder, name + WorkFolder.UnitExtension);
        }
        return fileOfUnit;
    }

    /// <summary>The command of the single run the merged results equal: the part's command without --part, --resume, --force and --out.</summary>
    public static IReadOnlyList<string> SingleRunCommand(IReadOnlyList<string> partCommand, string outputFolder)
    {
        var kept = new List<string>();
        for (int i = 0; i < partCommand.Count; i++)
        {
            string token = partCommand[i];
            if (token is "--part" or "--out") { i++; continue; }
            if (token.StartsWith("--part=", StringComparison.Ordinal) || token.StartsWith("--out=", StringComparison.Ordinal)) continue;
            if (token is "--resume" or "--force") continue;
            kept.Add(token);
        }
        kept.Add("--out");
        kept.Add(outputFolder);
        return kept;
    }
}
