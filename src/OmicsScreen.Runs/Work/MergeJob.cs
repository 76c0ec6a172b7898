using System.Diagnostics;
using OmicsScreen.Data;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Runs.Work;

/// <summary>
/// `merge`: checks the parts (<see cref="MergeChecks"/>), locks the results folder, loads the
/// inputs again (checking their SHA-256), and runs the screen with every work unit taken from the
/// parts, so the tables equal a single run's. <see cref="Open"/> makes every check before the
/// folder's earlier results are touched; <see cref="Run"/> clears them and screens.
/// </summary>
public sealed class MergeJob : IDisposable
{
    private readonly MergedParts _store;

    private MergeJob(ResultsFolder results, LoadedPanel loaded, double loadSeconds, RunRecord record, ScreenOptions screen,
        MergedParts store, int partCount, int unitCount)
    {
        Results = results;
        Loaded = loaded;
        LoadSeconds = loadSeconds;
        Record = record;
        Screen = screen;
        _store = store;
        PartCount = partCount;
        UnitCount = unitCount;
    }

    /// <summary>The results folder, locked until the job is disposed.</summary>
    public ResultsFolder Results { get; }

    /// <summary>The inputs the parts recorded, loaded again and found unchanged.</summary>
    public LoadedPanel Loaded { get; }
    public double LoadSeconds { get; }

    /// <summary>The parts' record of the run (all parts agree): how the panel was loaded, the command line, the sample-id setting.</summary>
    public RunRecord Record { get; }

    /// <summary>The parts' settings with this merge's thread count (which never changes a result).</summary>
    public ScreenOptions Screen { get; }
    public int PartCount { get; }
    public int UnitCount { get; }

    /// <param name="notes">Where the results folder's notes go (a folder it created, a kept file).</param>
    public static MergeJob Open(IReadOnlyList<string> partFolders, string outputFolder, bool force, int threadCount, TextWriter notes)
    {
        var parts = MergeChecks.ReadParts(partFolders);
        var first = parts[0].Record;
        MergeChecks.CheckTogether(parts);
        MergeChecks.CheckOutsideParts(outputFolder, parts);
        // The folder is checked and locked before the inputs are read again; a refused merge leaves it as it was.
        var results = ResultsFolder.Open(outputFolder, force, ResultsKind.Screen, ResultsFolder.InputPaths(first.LoadOptions), notes);
        try
        {
            var watch = Stopwatch.StartNew();
            var loaded = PanelLoader.Load(first.LoadOptions).EnsureScreenable();
            double loadSeconds = watch.Elapsed.TotalSeconds;
            MergeChecks.CheckInputsUnchanged(first, loaded);
            var screen = first.ScreenOptions with { ThreadCount = threadCount };
            var (identity, now) = RunIdentity.Of("merge", loaded, first.LoadOptions, screen, showSampleIds: false, commandLine: []);
            if (RunIdentity.Difference(first, now) is { } reason)
                throw new RunRefusedException($"The parts cannot be merged by this program: {reason}.", RunRefusal.Input);

            var settings = ScreenSettings.Resolve(screen, loaded.Panel);
            var plan = WorkPlan.For(loaded.Panel, settings);
            var fileOfUnit = MergeChecks.UnitFiles(plan, parts);
            var store = new MergedParts(fileOfUnit, identity, loaded.Panel.FeatureCount, settings.DecoyCount);
            store.CheckAll(plan.Units.Select(u => u.Unit));
            return new MergeJob(results, loaded, loadSeconds, first, screen, store, parts.Count, plan.Units.Count);
        }
        catch
        {
            results.Dispose();
            throw;
        }
    }

    /// <summary>Clears the folder's earlier results and screens with every unit from the parts (none is computed).</summary>
    public ScreenResult Run(IProgress<ScreenProgress>? progress, CancellationToken cancellation = default)
    {
        Results.ClearEarlierOutputs();
        return ScreenRunner.Run(Loaded.Panel, Screen, progress, cancellation, _store, computeMissing: false);
    }

    public void Dispose() => Results.Dispose();
}
