using System.IO.Compression;
using OmicsScreen.Data.Sizing;
using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Sizing;

/// <summary>Sizing a matrix file without parsing it gives the dimensions the loader then finds.</summary>
public class PanelDimensionReaderTests
{
    public static TheoryData<string> Encodings() => new(CrossFormatTests.Writers.Keys);

    [Theory]
    [MemberData(nameof(Encodings))]
    public void Every_format_and_orientation_is_sized_as_the_loaded_panel(string encoding)
    {
        using var folder = new TempFolder();
        var panel = SyntheticPanels.Mixed();
        // Without sample attribute rows, so a features-in-rows file holds feature rows only.
        var (path, layout) = CrossFormatTests.WriteAs(panel, folder, encoding, includeSampleAttributes: false);
        var sheet = folder.File("sheet.csv");
        DelimitedPanelWriter.WriteSheet(panel, sheet, [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11]);
        var options = SyntheticPanels.MixedOptions(path, layout) with { SampleSheetPath = sheet };

        var sized = PanelDimensionReader.TryRead(options);
        var loaded = PanelLoader.Load(options).Panel;

        Assert.NotNull(sized);
        Assert.Equal(loaded.SampleCount, sized.Value.SampleCount);
        Assert.Equal(loaded.FeatureCount, sized.Value.FeatureCount);
        Assert.Equal(new FileInfo(path).Length, sized.Value.FileBytes);
    }

    [Theory]
    [InlineData("csv-samples")]
    [InlineData("tsv-samples")]
    [InlineData("parquet-samples")]
    [InlineData("arrow-file-samples")]
    [InlineData("arrow-stream-samples")]
    public void Id_outcome_and_annotation_columns_of_the_matrix_are_not_counted_as_features(string encoding)
    {
        using var folder = new TempFolder();
        var panel = SyntheticPanels.Mixed();
        var (path, layout) = CrossFormatTests.WriteAs(panel, folder, encoding, includeSampleAttributes: true);
        var options = SyntheticPanels.MixedOptions(path, layout);

        var sized = PanelDimensionReader.TryRead(options);

        Assert.Equal(new PanelDimensions(12, 6, sized!.Value.Format, new FileInfo(path).Length), sized);
        Assert.Equal(PanelLoader.Load(options).Panel.FeatureCount, sized.Value.FeatureCount);
    }

    [Fact]
    public void Sample_attribute_rows_of_a_features_in_rows_file_make_the_feature_count_an_upper_bound()
    {
        using var folder = new TempFolder();
        var panel = SyntheticPanels.Mixed();
        var (path, layout) = CrossFormatTests.WriteAs(panel, folder, "csv-features", includeSampleAttributes: true);

        var sized = PanelDimensionReader.TryRead(SyntheticPanels.MixedOptions(path, layout))!.Value;

        Assert.Equal(12, sized.SampleCount);
        // Six feature rows and four attribute rows (status, centre, subject, site_note).
        Assert.Equal(6 + 4, sized.FeatureCount);
    }

    [Theory]
    [InlineData("\n")]
    [InlineData("\r\n")]
    [InlineData("\r")]
    public void Text_rows_are_counted_with_any_line_ending_and_without_a_final_line_break(string newline)
    {
        using var folder = new TempFolder();
        string text = string.Join(newline, "id,status,a,b,c", "s1,x,1,2,3", "s2,y,4,5,6", "s3,x,7,8,9");
        var withBreak = folder.Write("with.csv", text + newline);
        var withoutBreak = folder.Write("without.csv", text);

        foreach (var path in new[] { withBreak, withoutBreak })
        {
            var sized = PanelDimensionReader.TryRead(new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "status" });
            Assert.Equal(3, sized!.Value.SampleCount);
            Assert.Equal(3, sized.Value.FeatureCount);
        }
    }

    [Fact]
    public void A_gzip_file_is_sized_by_decompressing_it_once_and_a_truncated_one_is_left_to_the_loader()
    {
        using var folder = new TempFolder();
        string path = folder.File("panel.csv.gz");
        using (var gzip = new GZipStream(File.Create(path), CompressionLevel.Fastest))
            gzip.Write("id,status,a,b\ns1,x,1,2\ns2,y,3,4\ns3,y,5,6\n"u8);
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "status" };

        var sized = PanelDimensionReader.TryRead(options);

        // Counted by hand from the text written above: 3 sample lines, feature columns a and b.
        Assert.Equal((3, 2), (sized!.Value.SampleCount, sized.Value.FeatureCount));
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..^6]);
        Assert.Null(PanelDimensionReader.TryRead(options));
        Assert.Throws<PanelInputException>(() => PanelLoader.Load(options));
    }

    [Fact]
    public void A_missing_or_truncated_file_is_not_sized()
    {
        using var folder = new TempFolder();
        Assert.Null(PanelDimensionReader.TryRead(new PanelLoadOptions { MatrixPath = folder.File("absent.csv"), OutcomeColumn = "status" }));

        var (path, layout) = CrossFormatTests.WriteAs(SyntheticPanels.Mixed(), folder, "arrow-file-samples", includeSampleAttributes: true);
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(bytes.Length / 2)]);
        Assert.Null(PanelDimensionReader.TryRead(SyntheticPanels.MixedOptions(path, layout)));
    }
}
