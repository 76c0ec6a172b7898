using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Data.Demo;

namespace OmicsScreen.Cli.Commands;

/// <summary>The demo's steps: generate and write the study, check it, then run the main job on it.</summary>
internal static class DemoRun
{
    public static int Execute(CliConsole console, DemoRunOptions options)
    {
        var study = DemoStudyGenerator.Generate(new DemoStudyOptions { Seed = options.Seed });
        var files = DemoStudyWriter.Write(study, options.PanelFolder);
        console.Out.WriteLine($"Demo panel written: {files.Panel}");
        console.Out.WriteLine($"  sample sheet:     {files.SampleSheet}");
        console.Out.WriteLine($"  planted truth:    {files.Truth}");
        if (options.PanelOnly) return ExitCode.Success;

        var panel = new PanelLoadOptions
        {
            MatrixPath = files.Panel,
            SampleSheetPath = files.SampleSheet,
            OutcomeColumn = DemoStudy.OutcomeColumn,
            CohortColumn = DemoStudy.CentreColumn,
        };
        console.Out.WriteLine();
        int checkCode = CheckRun.Execute(console, panel, json: false);
        if (checkCode != ExitCode.Success) return checkCode;

        Directory.CreateDirectory(options.ReportFolder);
        string importance = Path.Combine(options.ReportFolder, "forest_importance.tsv");
        console.Out.WriteLine();
        int growCode = GrowRun.Execute(console, new GrowRunOptions { Panel = panel, ImportanceFile = importance });
        if (growCode != ExitCode.Success) return growCode;
        console.Out.WriteLine();
        console.Out.WriteLine($"Impurity decrease of every analyte: {importance}");
        console.Out.WriteLine($"Compare with what was planted:      {files.Truth}");
        return ExitCode.Success;
    }
}
