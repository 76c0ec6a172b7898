using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Runs.Results;
using OmicsScreen.Runs.Work;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Cli.Work;

/// <summary>`screen --part I/N`: computes one part's work units into a part folder for a later merge.</summary>
internal static class PartRun
{
    public static int Execute(CliConsole console, ScreenRunOptions options, LoadedPanel loaded, RunPart part)
    {
        string shown = options.OutputFolder
            ?? throw new CommandInputException("--part needs --out: the folder this part's results go to (one folder per part).");
        var panel = loaded.Panel;
        var settings = ScreenSettings.Resolve(options.Screen, panel);
        var plan = WorkPlan.For(panel, settings);
        if (part.Count > plan.Units.Count)
            throw new CommandInputException(
                $"This screen has {plan.Units.Count} work units, so it can be split into at most {plan.Units.Count} parts, not {part.Count}.");
        var units = plan.UnitsOfPart(part.Index, part.Count);
        var (identity, described) = RunIdentity.Of("part", loaded, options.Panel, options.Screen, options.ShowSampleIds, options.CommandLine);
        var record = described with { Part = part.Index, Parts = part.Count };
        var folder = WorkFolder.Open(shown, ScreenResultFiles.PartRecord, record, identity, panel.FeatureCount, settings.DecoyCount,
            options.Resume, options.Force, "part", shown);
        ScreenRun.PrintWarnings(console, ScreenRun.Warnings(options, loaded));

        var progress = new ProgressDisplay(console, options.Quiet);
        try
        {
            ScreenRunner.RunUnits(panel, options.Screen, units, folder, progress);
            progress.Finish();
        }
        finally
        {
            progress.Complete();
        }
        foreach (var discarded in folder.Discarded) console.Error.WriteLine($"warning: unit {discarded}; it was computed again.");
        folder.MarkComplete(units);
        console.Out.WriteLine($"Part {part}: {units.Count} of {plan.Units.Count} work units written to {folder.Path}"
            + (folder.ReusedCount > 0 ? $" ({folder.ReusedCount} kept from an earlier attempt)." : "."));
        console.Out.WriteLine($"When all {part.Count} parts are done: omicsscreen merge PART_FOLDER... --out RESULTS_FOLDER");
        return ExitCode.Success;
    }
}
