using System.Text;
using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests;

/// <summary>
/// The same panel written in every layout pipelines write (wide samples in rows, wide features in
/// rows with two describing columns, long, long gzip), with and without a feature sheet, loads to
/// the identical panel: values, cell states, sample attributes and feature names.
/// </summary>
public class SameInputEveryLayoutTests
{
    public static TheoryData<string> Layouts() => ["samples-in-rows", "features-in-rows-described", "long", "long-gzip"];

    private static (string Path, PanelLayout Layout) Write(string layout, TempFolder folder)
    {
        var panel = SyntheticPanels.Mixed();
        switch (layout)
        {
            case "samples-in-rows":
                string wide = folder.File("wide.csv");
                DelimitedPanelWriter.Write(panel, wide, PanelLayout.SamplesInRows, ',');
                return (wide, PanelLayout.SamplesInRows);
            case "features-in-rows-described":
                string described = folder.File("described.tsv");
                LayoutWriters.WriteFeaturesWithDescriptors(panel, described);
                return (described, PanelLayout.FeaturesInRows);
            case "long":
                return (folder.File("long.csv", LayoutWriters.LongText(panel)), PanelLayout.Long);
            default:
                string zipped = folder.File("long.csv.gz");
                File.WriteAllBytes(zipped, GzipFile.Compress(Encoding.UTF8.GetBytes(LayoutWriters.LongText(panel))));
                return (zipped, PanelLayout.Long);
        }
    }

    [Theory]
    [MemberData(nameof(Layouts))]
    public void Every_layout_loads_the_identical_panel(string layout)
    {
        using var folder = new TempFolder();
        var (path, panelLayout) = Write(layout, folder);

        var loaded = PanelLoader.Load(SyntheticPanels.MixedOptions(path, panelLayout));

        PanelAssert.Identical(SyntheticPanels.Mixed(), loaded.Panel);
        if (layout == "features-in-rows-described")
        {
            Assert.Equal(["symbol", "description"], loaded.Features.Annotations.Select(a => a.Name));
            Assert.Equal(Enumerable.Range(0, 6).Select(LayoutWriters.Description), loaded.Features.Annotations[1].Values);
        }
    }

    [Theory]
    [MemberData(nameof(Layouts))]
    public void Every_layout_with_a_feature_sheet_loads_the_identical_panel_censoring_and_names(string layout)
    {
        using var folder = new TempFolder();
        var (path, panelLayout) = Write(layout, folder);
        var (widePath, _) = Write("samples-in-rows", folder);
        string sheet = folder.File("features.csv", LayoutWriters.FeatureSheet(SyntheticPanels.Mixed(), limit: 0.5f));
        var reference = PanelLoader.Load(SyntheticPanels.MixedOptions(widePath, PanelLayout.SamplesInRows) with { FeatureSheetPath = sheet });

        var loaded = PanelLoader.Load(SyntheticPanels.MixedOptions(path, panelLayout) with { FeatureSheetPath = sheet });

        PanelAssert.Identical(reference.Panel, loaded.Panel);
        // The reference itself: features 0, 2, 4 have the limit 0.5, and some of their values lie below it.
        Assert.True(reference.Inspection.FeatureSheet!.CensoredCellTotal > 0);
        Assert.Equal(reference.Inspection.FeatureSheet.CensoredCells, loaded.Inspection.FeatureSheet!.CensoredCells);
        Assert.Equal(Enumerable.Range(0, 6).Select(f => $"Lab name {f}"), loaded.Features.DisplayNames);
        Assert.Equal(reference.Features.Annotations.Single(a => a.Name == "assay_panel").Values,
            loaded.Features.Annotations.Single(a => a.Name == "assay_panel").Values);
    }
}
