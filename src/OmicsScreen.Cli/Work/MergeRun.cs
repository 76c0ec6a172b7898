using System.Diagnostics;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Cli.Work;

/// <summary>
/// `merge`: checks that the parts belong to one run and that each of its N parts is there
/// exactly once and complete, loads the inputs again (checking their SHA-256), and runs the
/// screen with every work unit taken from the parts, so the tables equal a single run's.
/// </summary>
internal static class MergeRun
{
    public static int Execute(CliConsole console, MergeRunOptions options)
    {
        var started = DateTimeOffset.UtcNow;
        var parts = ReadParts(options.PartFolders);
        var first = parts[0].Record;
        CheckTogether(parts);
        CheckOutsideParts(options.OutputFolder, parts);
        // The folder is checked and locked before the inputs are read again; a refused merge leaves it as it was.
        using var results = ResultsFolder.Open(options.OutputFolder, options.Force, ResultsKind.Screen,
            ScreenRun.InputPaths(first.LoadOptions), console.Error);

        var watch = Stopwatch.StartNew();
        var loaded = PanelLoader.Load(first.LoadOptions).EnsureScreenable();
        double loadSeconds = watch.Elapsed.TotalSeconds;
        CheckInputsUnchanged(first, loaded);
        var screen = first.ScreenOptions with { ThreadCount = options.ThreadCount };
        var (identity, now) = RunIdentity.Of("merge", loaded, new ScreenRunOptions { Panel = first.LoadOptions, Screen = screen });
        if (RunIdentity.Difference(first, now) is { } reason)
            throw new CommandInputException($"The parts cannot be merged by this program: {reason}.", ExitCode.InputError);

        var settings = ScreenSettings.Resolve(screen, loaded.Panel);
        var plan = WorkPlan.For(loaded.Panel, settings);
        var fileOfUnit = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (folder, record) in parts)
        {
            var expected = plan.UnitsOfPart(record.Part, record.Parts).Select(u => u.Name).ToArray();
            if (!expected.SequenceEqual(record.Units))
                throw new CommandInputException(
                    $"{folder} does not list the work units of part {record.Part} of {record.Parts}; run that part again, then merge.",
                    ExitCode.InputError);
            foreach (var name in expected) fileOfUnit[name] = Path.Combine(folder, name + WorkFolder.UnitExtension);
        }
        var store = new MergedParts(fileOfUnit, identity, loaded.Panel.FeatureCount, settings.DecoyCount);
        store.CheckAll(plan.Units.Select(u => u.Unit));

        var runOptions = new ScreenRunOptions
        {
            Panel = first.LoadOptions,
            Screen = screen,
            OutputFolder = options.OutputFolder,
            Force = options.Force,
            Quiet = options.Quiet,
            ShowSampleIds = first.ShowSampleIds,
            CommandLine = SingleRunCommand(first.CommandLine, options.OutputFolder),
        };
        results.ClearEarlierOutputs();
        var progress = new ProgressDisplay(console, options.Quiet);
        ScreenResult result;
        try
        {
            result = ScreenRunner.Run(loaded.Panel, screen, progress, default, store, computeMissing: false);
            progress.Finish();
        }
        finally
        {
            progress.Complete();
        }
        ScreenRun.WriteResults(console, runOptions, loaded, result, results, started, loadSeconds, parts.Count);
        console.Out.WriteLine($"Merged {parts.Count} parts ({plan.Units.Count} work units).");
        return ExitCode.Success;
    }

    /// <summary>The results folder must not be, or hold, one of the parts: writing it would replace what is being merged.</summary>
    private static void CheckOutsideParts(string outputFolder, List<(string Folder, RunRecord Record)> parts)
    {
        string output = Path.TrimEndingDirectorySeparator(Path.GetFullPath(outputFolder));
        foreach (var (folder, _) in parts)
        {
            string part = Path.TrimEndingDirectorySeparator(folder);
            if (part == output || part.StartsWith(output + Path.DirectorySeparatorChar, StringComparison.Ordinal)
                || output.StartsWith(part + Path.DirectorySeparatorChar, StringComparison.Ordinal))
                throw new CommandInputException(
                    $"--out {outputFolder} is, or overlaps, the part folder {folder} being merged; give the merged results a folder of their own.",
                    ExitCode.OutputError);
        }
    }

    private static List<(string Folder, RunRecord Record)> ReadParts(IReadOnlyList<string> folders)
    {
        if (folders.Count == 0) throw new CommandInputException("Give the part folders to merge.");
        var parts = new List<(string, RunRecord)>();
        foreach (var folder in folders)
        {
            string full = Path.GetFullPath(folder);
            if (!Directory.Exists(full))
                throw new CommandInputException($"{folder} is not a folder; give the folders written by `screen --part I/N --out FOLDER`.", ExitCode.InputError);
            var record = WorkFolder.TryReadRecord(Path.Combine(full, PartRun.RecordFileName), out var problem);
            if (record is null || record.Kind != "part")
                throw new CommandInputException($"{folder} is not a part of a split screen: it {problem ?? "holds a checkpoint, not a part"}.", ExitCode.InputError);
            if (!record.Complete)
                throw new CommandInputException($"{folder} is part {record.Part} of {record.Parts}, but it did not finish; run it again (with --resume to keep its finished units), then merge.", ExitCode.InputError);
            parts.Add((full, record));
        }
        return parts;
    }

    private static void CheckTogether(List<(string Folder, RunRecord Record)> parts)
    {
        var (firstFolder, first) = parts[0];
        foreach (var (folder, record) in parts.Skip(1))
        {
            if (RunIdentity.Difference(first, record) is { } reason)
                throw new CommandInputException(
                    $"{folder} belongs to a different run than {firstFolder} ({reason}, judged against {firstFolder}); merge only the parts of one run.",
                    ExitCode.InputError);
            if (record.Parts != first.Parts)
                throw new CommandInputException(
                    $"{folder} is a part of {record.Parts}, {firstFolder} a part of {first.Parts}; merge the parts of one split.", ExitCode.InputError);
        }
        var seen = new Dictionary<int, string>();
        foreach (var (folder, record) in parts)
        {
            if (seen.TryGetValue(record.Part, out var other))
                throw new CommandInputException($"Part {record.Part} of {record.Parts} is given twice: {other} and {folder}.", ExitCode.InputError);
            seen[record.Part] = folder;
        }
        var missing = Enumerable.Range(1, first.Parts).Where(p => !seen.ContainsKey(p)).ToArray();
        if (missing.Length > 0)
            throw new CommandInputException(
                $"Part{(missing.Length > 1 ? "s" : "")} {string.Join(", ", missing)} of {first.Parts} {(missing.Length > 1 ? "are" : "is")} missing; run {(missing.Length > 1 ? "them" : "it")}, then merge all {first.Parts}.",
                ExitCode.InputError);
    }

    private static void CheckInputsUnchanged(RunRecord record, LoadedPanel loaded)
    {
        foreach (var recorded in record.Inputs)
        {
            var now = loaded.Inputs.FirstOrDefault(i => Path.GetFullPath(i.Path) == recorded.Path);
            if (now is null || now.Sha256 != recorded.Sha256)
                throw new CommandInputException(
                    $"{recorded.Path} changed since the parts ran (SHA-256 {recorded.Sha256[..12]}... then, {(now?.Sha256[..12] ?? "absent")}... now); "
                    + "run the parts again on the current file, or restore the original.", ExitCode.InputError);
        }
    }

    /// <summary>The command of the single run the merged results equal: the part's command without --part, --resume, --force and --out.</summary>
    internal static IReadOnlyList<string> SingleRunCommand(IReadOnlyList<string> partCommand, string outputFolder)
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
