using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Runs.Output;

namespace OmicsScreen.Cli.Commands;

/// <summary>Loads a panel and prints its inspection; the exit code says whether it can be screened.</summary>
internal static class CheckRun
{
    public static int Execute(CliConsole console, PanelLoadOptions options, bool json)
    {
        InputPathGuard.Check(options.MatrixPath, "matrix");
        InputPathGuard.Check(options.SampleSheetPath, "sample sheet");
        InputPathGuard.Check(options.FeatureSheetPath, "feature sheet");
        var loaded = PanelLoader.Load(options);
        if (json) InspectionPrinter.WriteJson(loaded, console.Out);
        else InspectionPrinter.WriteTable(loaded, console.Out);
        if (CanScreen(loaded)) return ExitCode.Success;
        console.Error.WriteLine("The panel cannot be screened as it is: see the errors above.");
        return ExitCode.NotScreenable;
    }

    /// <summary>No Error finding: `check` gives the exit code that `screen` gives for the same files (any outcome kind).</summary>
    public static bool CanScreen(LoadedPanel loaded) => loaded.Inspection.CanScreen;
}
