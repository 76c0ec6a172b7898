using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Runs.Work;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Work;

/// <summary>
/// `merge` on the console: the job (<see cref="MergeJob"/>) with progress, then the results
/// written and summarised exactly as a single run's.
/// </summary>
internal static class MergeRun
{
    public static int Execute(CliConsole console, MergeRunOptions options)
    {
        var started = DateTimeOffset.UtcNow;
        using var merge = MergeJob.Open(options.PartFolders, options.OutputFolder, options.Force, options.ThreadCount, console.Error);
        var record = merge.Record;
        var runOptions = new ScreenRunOptions
        {
            Panel = record.LoadOptions,
            Screen = merge.Screen,
            OutputFolder = options.OutputFolder,
            Force = options.Force,
            Quiet = options.Quiet,
            ShowSampleIds = record.ShowSampleIds,
            CommandLine = MergeChecks.SingleRunCommand(record.CommandLine, options.OutputFolder),
        };
        var progress = new ProgressDisplay(console, options.Quiet);
        ScreenResult result;
        try
        {
            result = merge.Run(progress);
            progress.Finish();
        }
        finally
        {
            progress.Complete();
        }
        ScreenRun.WriteResults(console, runOptions, merge.Loaded, result, merge.Results, started, merge.LoadSeconds, merge.PartCount);
        console.Out.WriteLine($"Merged {merge.PartCount} parts ({merge.UnitCount} work units).");
        return ExitCode.Success;
    }
}
