using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Writing;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// The binary seeds of the fuzz corpus: the text seeds' panel written by the project's own
/// writers as Parquet (several row groups), an Arrow IPC file and an Arrow IPC stream.
/// </summary>
internal static class BinarySeedPanels
{
    public static IReadOnlyList<FuzzSeedPanel> All()
    {
        using var folder = new TempFolder();
        var samples = TextSeedPanels.Panel(withCohort: false);
        var features = TextSeedPanels.Panel(withCohort: true);
        return
        [
            Seed("samples-in-rows Parquet in row groups of 8", "panel.parquet", samples, PanelLayout.SamplesInRows,
                path => ParquetPanelWriter.Write(samples, path, PanelLayout.SamplesInRows, rowGroupRows: 8), folder),
            Seed("samples-in-rows Arrow IPC file", "panel.arrow", samples, PanelLayout.SamplesInRows,
                path => ArrowPanelWriter.Write(samples, path, PanelLayout.SamplesInRows), folder),
            Seed("features-in-rows Arrow IPC stream in batches of 5", "panel.arrows", features, PanelLayout.FeaturesInRows,
                path => ArrowPanelWriter.Write(features, path, PanelLayout.FeaturesInRows, asStream: true, batchRows: 5), folder),
        ];
    }

    private static FuzzSeedPanel Seed(string name, string fileName, Engine.Panels.Panel panel, PanelLayout layout,
        Action<string> write, TempFolder folder)
    {
        string path = folder.File(fileName);
        write(path);
        return new FuzzSeedPanel(name, fileName, File.ReadAllBytes(path), IsText: false, '\0', layout, panel,
            TextSeedPanels.OutcomeColumn, panel.Cohort?.ColumnName);
    }
}
