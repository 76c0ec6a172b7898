using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Writing;

namespace OmicsScreen.Data.Tests;

/// <summary>The same panel in every supported format and orientation loads to identical values, names, labels and cell states.</summary>
public class CrossFormatTests
{
    public static TheoryData<string> Encodings() =>
    [
        "csv-samples", "tsv-samples", "semicolon-samples", "csv-bom-crlf-samples", "csv-features", "tsv-features",
        "parquet-samples", "parquet-features", "parquet-samples-row-groups",
        "arrow-file-samples", "arrow-stream-samples", "arrow-file-features", "arrow-stream-features-batches",
    ];

    [Theory]
    [MemberData(nameof(Encodings))]
    public void Every_format_and_orientation_loads_the_identical_panel(string encoding)
    {
        using var folder = new TempFolder();
        var expected = SyntheticPanels.Mixed();
        var (path, layout) = WriteAs(expected, folder, encoding, includeSampleAttributes: true);

        var loaded = PanelLoader.Load(SyntheticPanels.MixedOptions(path, layout));

        PanelAssert.Identical(expected, loaded.Panel);
        Assert.Equal(3, loaded.Inspection.BelowDetectionCellCount);
        Assert.Equal(2, loaded.Inspection.BelowDetectionFeatureCount);
    }

    [Theory]
    [MemberData(nameof(Encodings))]
    public void Every_format_joined_to_a_shuffled_sample_sheet_loads_the_identical_panel(string encoding)
    {
        using var folder = new TempFolder();
        var expected = SyntheticPanels.Mixed();
        var (path, layout) = WriteAs(expected, folder, encoding, includeSampleAttributes: false);
        var sheet = folder.File("sheet.csv");
        DelimitedPanelWriter.WriteSheet(expected, sheet, [11, 3, 0, 7, 1, 2, 10, 4, 5, 9, 6, 8]);

        var loaded = PanelLoader.Load(SyntheticPanels.MixedOptions(path, layout) with { SampleSheetPath = sheet });

        PanelAssert.Identical(expected, loaded.Panel);
    }

    private static (string Path, PanelLayout Layout) WriteAs(Engine.Panels.Panel panel, TempFolder folder, string encoding,
        bool includeSampleAttributes)
    {
        var samples = PanelLayout.SamplesInRows;
        var features = PanelLayout.FeaturesInRows;
        bool all = includeSampleAttributes;
        string path;
        switch (encoding)
        {
            case "csv-samples":
                DelimitedPanelWriter.Write(panel, path = folder.File("panel.csv"), samples, ',', includeSampleAttributes: all);
                return (path, samples);
            case "tsv-samples":
                DelimitedPanelWriter.Write(panel, path = folder.File("panel.tsv"), samples, '\t', includeSampleAttributes: all);
                return (path, samples);
            case "semicolon-samples":
                DelimitedPanelWriter.Write(panel, path = folder.File("panel.csv"), samples, ';', includeSampleAttributes: all);
                return (path, samples);
            case "csv-bom-crlf-samples":
                DelimitedPanelWriter.Write(panel, path = folder.File("panel.csv"), samples, ',', byteOrderMark: true,
                    newline: "\r\n", includeSampleAttributes: all);
                return (path, samples);
            case "csv-features":
                DelimitedPanelWriter.Write(panel, path = folder.File("panel.csv"), features, ',', includeSampleAttributes: all);
                return (path, features);
            case "tsv-features":
                DelimitedPanelWriter.Write(panel, path = folder.File("panel.tsv"), features, '\t', includeSampleAttributes: all);
                return (path, features);
            case "parquet-samples":
                ParquetPanelWriter.Write(panel, path = folder.File("panel.parquet"), samples, includeSampleAttributes: all);
                return (path, samples);
            case "parquet-features":
                ParquetPanelWriter.Write(panel, path = folder.File("panel.parquet"), features, includeSampleAttributes: all);
                return (path, features);
            case "parquet-samples-row-groups":
                ParquetPanelWriter.Write(panel, path = folder.File("panel.parquet"), samples, rowGroupRows: 5,
                    includeSampleAttributes: all);
                return (path, samples);
            case "arrow-file-samples":
                ArrowPanelWriter.Write(panel, path = folder.File("panel.arrow"), samples, includeSampleAttributes: all);
                return (path, samples);
            case "arrow-stream-samples":
                ArrowPanelWriter.Write(panel, path = folder.File("panel.arrows"), samples, asStream: true, batchRows: 5,
                    includeSampleAttributes: all);
                return (path, samples);
            case "arrow-file-features":
                ArrowPanelWriter.Write(panel, path = folder.File("panel.arrow"), features, includeSampleAttributes: all);
                return (path, features);
            case "arrow-stream-features-batches":
                ArrowPanelWriter.Write(panel, path = folder.File("panel.arrows"), features, asStream: true, batchRows: 2,
                    includeSampleAttributes: all);
                return (path, features);
            default:
                throw new ArgumentOutOfRangeException(nameof(encoding), encoding, null);
        }
    }
}
