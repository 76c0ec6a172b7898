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
        var withBreak = folder.File("with.csv", text + newline);
        var withoutBreak = folder.File("without.csv", text);

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

    [Theory]
    [InlineData(16, 16)]
    [InlineData(17, 32)]
    [InlineData(300, 512)]
    [InlineData(1024, 1024)]
    public void A_long_table_is_estimated_to_hold_its_columns_at_the_capacity_their_doubling_reaches(int samples, int capacity)
    {
        // LongTableReader grows each feature's values (4 bytes) and states (1 byte) by doubling from 16 rows:
        // capacity x 5 bytes against the panel's 4 bytes per sample, in float32 matrices.
        var sized = new PanelDimensions(samples, 100, MatrixFileFormat.DelimitedText, 1L << 20, PanelLayout.Long);

        Assert.Equal(1.25 * capacity / samples, sized.LoaderMatrixCopies, 12);
        // Wide text, plain or gzip, gathers its parsed columns into one more matrix, whatever the file's size.
        Assert.Equal(1, (sized with { Layout = PanelLayout.SamplesInRows }).LoaderMatrixCopies);
    }

    [Fact]
    public void A_long_file_is_sized_with_its_layout_for_the_estimate()
    {
        using var folder = new TempFolder();
        string path = folder.File("long.csv", "sample,feature,value,status\ns1,A,1,x\ns1,B,2,x\ns2,A,3,y\ns3,B,4,y\n");

        var sized = PanelDimensionReader.TryRead(new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "status", Layout = PanelLayout.Long });

        // Counted by hand from the rows above: samples s1..s3, features A and B.
        Assert.Equal(new PanelDimensions(3, 2, MatrixFileFormat.DelimitedText, new FileInfo(path).Length, PanelLayout.Long), sized);
    }
}
