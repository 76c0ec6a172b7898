using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Writing;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests;

/// <summary>The same panel in every supported format and orientation loads to identical values, names, labels and cell states.</summary>
public class CrossFormatTests
{
    public static TheoryData<string> Encodings() => new(Writers.Keys);

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

    private const PanelLayout Samples = PanelLayout.SamplesInRows;
    private const PanelLayout Features = PanelLayout.FeaturesInRows;

    /// <summary>Per encoding: file name, orientation, and the writer (panel, path, include sample attributes).</summary>
    internal static readonly Dictionary<string, (string File, PanelLayout Layout, Action<Panel, string, bool> Write)> Writers = new()
    {
        ["csv-samples"] = ("panel.csv", Samples, (p, f, a) => DelimitedPanelWriter.Write(p, f, Samples, ',', includeSampleAttributes: a)),
        ["tsv-samples"] = ("panel.tsv", Samples, (p, f, a) => DelimitedPanelWriter.Write(p, f, Samples, '\t', includeSampleAttributes: a)),
        ["semicolon-samples"] = ("panel.csv", Samples, (p, f, a) => DelimitedPanelWriter.Write(p, f, Samples, ';', includeSampleAttributes: a)),
        ["csv-bom-crlf-samples"] = ("panel.csv", Samples,
            (p, f, a) => DelimitedPanelWriter.Write(p, f, Samples, ',', byteOrderMark: true, newline: "\r\n", includeSampleAttributes: a)),
        // gzip content under a name that does not say so, and under one that does: detected by the magic bytes (RFC 1952, 2.3.1).
        ["csv-gzip-samples"] = ("panel.csv", Samples, (p, f, a) => GzipFile.Write(f, w => DelimitedPanelWriter.Write(p, w, Samples, ',', includeSampleAttributes: a))),
        ["tsv-gzip-features"] = ("panel.tsv.gz", Features, (p, f, a) => GzipFile.Write(f, w => DelimitedPanelWriter.Write(p, w, Features, '\t', includeSampleAttributes: a))),
        ["csv-features"] = ("panel.csv", Features, (p, f, a) => DelimitedPanelWriter.Write(p, f, Features, ',', includeSampleAttributes: a)),
        ["tsv-features"] = ("panel.tsv", Features, (p, f, a) => DelimitedPanelWriter.Write(p, f, Features, '\t', includeSampleAttributes: a)),
        ["parquet-samples"] = ("panel.parquet", Samples, (p, f, a) => ParquetPanelWriter.Write(p, f, Samples, includeSampleAttributes: a)),
        ["parquet-features"] = ("panel.parquet", Features, (p, f, a) => ParquetPanelWriter.Write(p, f, Features, includeSampleAttributes: a)),
        ["parquet-samples-row-groups"] = ("panel.parquet", Samples,
            (p, f, a) => ParquetPanelWriter.Write(p, f, Samples, rowGroupRows: 5, includeSampleAttributes: a)),
        ["arrow-file-samples"] = ("panel.arrow", Samples, (p, f, a) => ArrowPanelWriter.Write(p, f, Samples, includeSampleAttributes: a)),
        ["arrow-stream-samples"] = ("panel.arrows", Samples,
            (p, f, a) => ArrowPanelWriter.Write(p, f, Samples, asStream: true, batchRows: 5, includeSampleAttributes: a)),
        ["arrow-file-features"] = ("panel.arrow", Features, (p, f, a) => ArrowPanelWriter.Write(p, f, Features, includeSampleAttributes: a)),
        ["arrow-stream-features-batches"] = ("panel.arrows", Features,
            (p, f, a) => ArrowPanelWriter.Write(p, f, Features, asStream: true, batchRows: 2, includeSampleAttributes: a)),
    };

    internal static (string Path, PanelLayout Layout) WriteAs(Panel panel, TempFolder folder, string encoding,
        bool includeSampleAttributes)
    {
        var (file, layout, write) = Writers[encoding];
        string path = folder.File(file);
        write(panel, path, includeSampleAttributes);
        return (path, layout);
    }
}
