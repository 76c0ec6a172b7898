using System.Diagnostics;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Runs;
using OmicsScreen.Runs.Results;
using OmicsScreen.Runs.Work;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Cli.Work;

/// <summary>
/// `merge`: checks the parts (<see cref="MergeChecks"/>), loads the inputs again (checking
/// their SHA-256), and runs the screen with every work unit taken from the parts, so the tables
/// equal a single run's.
/// </summary>
internal static class MergeRun
{
    public static int Execute(CliConsole console, MergeRunOptions options)
    {
        var started = DateTimeOffset.UtcNow;
        var parts = MergeChecks.ReadParts(options.PartFolders);
        var first = parts[0].Record;
        MergeChecks.CheckTogether(parts);
        MergeChecks.CheckOutsideParts(options.OutputFolder, parts);
        // The folder is checked and locked before the inputs are read again; a refused merge leaves it as it was.
        using var results = ResultsFolder.Open(options.OutputFolder, options.Force, ResultsKind.Screen,
            ScreenRun.InputPaths(first.LoadOptions), console.Error);

        var watch = Stopwatch.StartNew();
        var loaded = PanelLoader.Load(first.LoadOptions).EnsureScreenable(classesOnly: false);
        double loadSeconds = watch.Elapsed.TotalSeconds;
        MergeChecks.CheckInputsUnchanged(first, loaded);
        var screen = first.ScreenOptions with { ThreadCount = options.ThreadCount };
        var (identity, now) = RunIdentity.Of("merge", loaded, first.LoadOptions, screen, showSampleIds: false, commandLine: []);
        if (RunIdentity.Difference(first, now) is { } reason)
            throw new RunRefusedException($"The parts cannot be merged by this program: {reason}.", RunRefusal.Input);

        var settings = ScreenSettings.Resolve(screen, loaded.Panel);
        var plan = WorkPlan.For(loaded.Panel, settings);
        var fileOfUnit = MergeChecks.UnitFiles(plan, parts);
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
            CommandLine = MergeChecks.SingleRunCommand(first.CommandLine, options.OutputFolder),
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
}
