using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>Comment lines above the header are skipped and counted; one inside the data is an error naming its line.</summary>
public class CommentLineTests
{
    // Common practice: laboratory exports put their date or instrument above the header after '#';
    // series-matrix files of public expression repositories put metadata lines starting with '!'
    // there (from memory of their layout).
    private const string Comments = "# exported 2026-01-05 by instrument X-1\n!Series_note\t\"two, parts\"\n\n  # indented comment\n";

    [Theory]
    [InlineData(PanelLayout.SamplesInRows, "id,status,a,b\ns1,x,1,2\ns2,y,3,4\ns3,y,5,<LOD\n")]
    [InlineData(PanelLayout.FeaturesInRows, "feature,s1,s2,s3\nstatus,x,y,y\na,1,3,5\nb,2,4,<LOD\n")]
    public void Comment_lines_above_the_header_are_skipped_and_counted(PanelLayout layout, string panel)
    {
        using var folder = new TempFolder();
        var options = new PanelLoadOptions { MatrixPath = folder.File("plain.csv", panel), OutcomeColumn = "status", Layout = layout };
        var plain = PanelLoader.Load(options);
        var commented = PanelLoader.Load(options with { MatrixPath = folder.File("commented.csv", Comments + panel) });

        PanelAssert.Identical(plain.Panel, commented.Panel);
        // Three comment lines were written above the header (the blank line is not one).
        Assert.Equal(3, commented.Inspection.CommentLineCount);
        Assert.Equal(0, plain.Inspection.CommentLineCount);
    }

    [Theory]
    [InlineData(PanelLayout.SamplesInRows, "id,status,a,b\ns1,x,1,2\n# a note\ns2,y,3,4\ns3,y,5,6\n", 3)]
    [InlineData(PanelLayout.SamplesInRows, "id,status,a,b\ns1,x,1,2\ns2,y,3,4\n!s3,y,5,6\n", 4)]
    [InlineData(PanelLayout.FeaturesInRows, "feature,s1,s2,s3\nstatus,x,y,y\na,1,3,5\n#b,2,4,6\n", 4)]
    public void A_comment_line_inside_the_data_is_an_error_naming_the_file_and_line(PanelLayout layout, string panel, int line)
    {
        using var folder = new TempFolder();
        var options = new PanelLoadOptions { MatrixPath = folder.File("m.csv", panel), OutcomeColumn = "status", Layout = layout };

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(options));

        Assert.StartsWith($"m.csv, line {line}: ", error.Message);
        Assert.Contains("comment line inside the data", error.Message);
    }

    [Fact]
    public void Comment_lines_above_the_header_of_a_gzip_file_are_skipped_too()
    {
        using var folder = new TempFolder();
        string plain = folder.File("plain.csv", "id,status,a\ns1,x,1\ns2,y,2\n");
        string zipped = folder.File("zipped.csv.gz");
        File.WriteAllBytes(zipped, GzipFile.Compress(System.Text.Encoding.UTF8.GetBytes("!meta\n#meta\nid,status,a\ns1,x,1\ns2,y,2\n")));

        var loaded = PanelLoader.Load(new PanelLoadOptions { MatrixPath = zipped, OutcomeColumn = "status" });

        PanelAssert.Identical(PanelLoader.Load(new PanelLoadOptions { MatrixPath = plain, OutcomeColumn = "status" }).Panel, loaded.Panel);
        Assert.Equal(2, loaded.Inspection.CommentLineCount);
    }
}
