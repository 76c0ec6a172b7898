using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Runs.Results;
using OmicsScreen.Runs.Work;

namespace OmicsScreen.Cli.Work;

/// <summary>`screen --part I/N` on the console: the job (<see cref="PartJob"/>) with warnings, progress and what to do next.</summary>
internal static class PartRun
{
    public static int Execute(CliConsole console, ScreenRunOptions options, LoadedPanel loaded, RunPart part)
    {
        string folder = options.OutputFolder
            ?? throw new CommandInputException("--part needs --out: the folder this part's results go to (one folder per part).");
        var job = PartJob.Open(loaded, new PartRequest
        {
            Panel = options.Panel,
            Screen = options.Screen,
            Part = part,
            Folder = folder,
            Resume = options.Resume,
            Force = options.Force,
            ShowSampleIds = options.ShowSampleIds,
            CommandLine = options.CommandLine,
        });
        ScreenRun.PrintWarnings(console, ScreenWarnings.Of(options.Screen, loaded));

        var progress = new ProgressDisplay(console, options.Quiet);
        try
        {
            job.Run(progress);
            progress.Finish();
        }
        finally
        {
            progress.Complete();
        }
        foreach (var discarded in job.Folder.Discarded) console.Error.WriteLine($"warning: unit {discarded}; it was computed again.");
        console.Out.WriteLine($"Part {part}: {job.Units.Count} of {job.UnitCount} work units written to {job.Folder.Path}"
            + (job.Folder.ReusedCount > 0 ? $" ({job.Folder.ReusedCount} kept from an earlier attempt)." : "."));
        console.Out.WriteLine($"When all {part.Count} parts are done: omicsscreen merge PART_FOLDER... --out RESULTS_FOLDER");
        return ExitCode.Success;
    }
}
