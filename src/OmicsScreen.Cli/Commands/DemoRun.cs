using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Data.Demo;
using OmicsScreen.Runs.Output;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>The demo's steps: generate and write the study, check it, then screen it.</summary>
internal static class DemoRun
{
    public static int Execute(CliConsole console, DemoRunOptions options)
    {
        // Files already in the panel folder are replaced only when an earlier demo wrote them.
        foreach (var (fileName, start) in DemoStudyWriter.FileStarts)
            OutputPathGuard.CheckFile(Path.Combine(options.PanelFolder, fileName), "--panel-dir", [], start);
        var study = DemoStudyGenerator.Generate(new DemoStudyOptions { Seed = options.Seed });
        var files = DemoStudyWriter.Write(study, options.PanelFolder);
        console.Out.WriteLine($"Demo panel written: {files.Panel}");
        console.Out.WriteLine($"  sample sheet:     {files.SampleSheet}");
        console.Out.WriteLine($"  feature sheet:    {files.FeatureSheet}");
        console.Out.WriteLine($"  planted truth:    {files.Truth}");
        if (options.PanelOnly) return ExitCode.Success;

        var panel = new PanelLoadOptions
        {
            MatrixPath = files.Panel,
            SampleSheetPath = files.SampleSheet,
            FeatureSheetPath = files.FeatureSheet,
            OutcomeColumn = DemoStudy.OutcomeColumn,
            CohortColumn = DemoStudy.CentreColumn,
        };
        console.Out.WriteLine();
        int checkCode = CheckRun.Execute(console, panel, json: false);
        if (checkCode != ExitCode.Success) return checkCode;

        console.Out.WriteLine();
        var commandLine = new List<string>
        {
            "omicsscreen", "screen", files.Panel, "--samples", files.SampleSheet, "--feature-sheet", files.FeatureSheet, "--outcome", DemoStudy.OutcomeColumn,
            "--cohort", DemoStudy.CentreColumn, "--out", options.ReportFolder, "--force",
        };
        if (options.Quiet) commandLine.Add("--quiet");
        int screenCode = ScreenRun.Execute(console, new ScreenRunOptions
        {
            Panel = panel,
            Screen = new ScreenOptions(),
            OutputFolder = options.ReportFolder,
            // The demo's folder is the demo's own: rerunning the demo replaces it.
            Force = true,
            Quiet = options.Quiet,
            CommandLine = commandLine,
        });
        if (screenCode != ExitCode.Success) return screenCode;
        console.Out.WriteLine($"Compare the shortlist with what was planted: {files.Truth}");
        return ExitCode.Success;
    }
}
