using System.Text;
using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>
/// Sample and feature sheets are read like the matrix: gzip-compressed (told by content), with
/// comment lines above the header skipped and counted, and a comment line inside the data refused.
/// </summary>
public class SheetTextTests
{
    private const string Matrix = "id,F1,F2,F3\ns1,1,0.2,<LOD\ns2,2,0.5,NA\ns3,3,0.05,9\ns4,0.4,0.3,<0.01\n";

    private const string Samples = "sample,status,centre\ns1,x,north\ns2,y,north\ns3,y,south\ns4,x,south\n";

    private const string Features = "feature,display_name,detection_limit\nF1,Marker A,1.5\nF2,Marker B,0.3\nF3,Marker C,\n";

    /// <summary>Export headers of the kind laboratory systems write ('#') and series-matrix metadata ('!'), common practice.</summary>
    private const string Comments = "# exported 2026-01-05 by an invented LIMS\n! series_title \"invented\"\n#\n";

    private static PanelLoadOptions Options(string matrix, string samples, string features) => new()
    {
        MatrixPath = matrix, OutcomeColumn = "status", CohortColumn = "centre", SampleSheetPath = samples, FeatureSheetPath = features,
    };

    [Fact]
    public void Gzip_sheets_with_comment_lines_load_the_panel_names_and_censoring_of_plain_sheets()
    {
        using var folder = new TempFolder();
        string matrix = folder.File("m.csv", Matrix);
        var plain = PanelLoader.Load(Options(matrix, folder.File("samples.csv", Samples), folder.File("features.csv", Features)));
        // No .gz in the names: a sheet, like the matrix, is told gzip by its magic bytes 1F 8B (RFC 1952, section 2.3.1).
        string samples = folder.File("samples.txt");
        File.WriteAllBytes(samples, GzipFile.Compress(Encoding.UTF8.GetBytes(Comments + Samples)));
        string features = folder.File("features.txt");
        File.WriteAllBytes(features, GzipFile.Compress(Encoding.UTF8.GetBytes(Comments + Features)));

        var loaded = PanelLoader.Load(Options(matrix, samples, features));

        PanelAssert.Identical(plain.Panel, loaded.Panel);
        Assert.Equal(["Marker A", "Marker B", "Marker C"], loaded.Features.DisplayNames);
        // F1 = 1, 2, 3, 0.4 under the limit 1.5: samples 1 and 4; F2 = 0.2, 0.5, 0.05, 0.3 under 0.3: samples 1 and 3 (read off the text above).
        Assert.Equal(4, loaded.Inspection.FeatureSheet!.CensoredCellTotal);
        Assert.Equal(plain.Inspection.FeatureSheet!.CensoredCells, loaded.Inspection.FeatureSheet.CensoredCells);
        // Three comment lines in each sheet, as written above; none in the plain ones.
        Assert.Equal(("gzip", 3), (loaded.Inspection.SampleSheetCompression, loaded.Inspection.SampleSheetCommentLineCount));
        Assert.Equal(("gzip", 3), (loaded.Inspection.FeatureSheet.Compression, loaded.Inspection.FeatureSheet.CommentLineCount));
        Assert.Equal((null, 0), (plain.Inspection.SampleSheetCompression, plain.Inspection.SampleSheetCommentLineCount));
    }

    [Theory]
    [InlineData("samples")]
    [InlineData("features")]
    public void A_comment_line_inside_a_sheets_data_is_refused_naming_the_sheet_and_line(string which)
    {
        using var folder = new TempFolder();
        string matrix = folder.File("m.csv", Matrix);
        // The comment is the third line of the sheet: header, one row, then the comment.
        static string WithComment(string sheet)
        {
            var lines = sheet.Split('\n');
            return string.Join('\n', [lines[0], lines[1], "# a note left in the data", .. lines[2..]]);
        }
        string samples = folder.File("samples.csv", which == "samples" ? WithComment(Samples) : Samples);
        string features = folder.File("features.csv", which == "features" ? WithComment(Features) : Features);

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(matrix, samples, features)));

        Assert.StartsWith($"{which}.csv, line 3: starts with '#' or '!'", error.Message);
        Assert.Contains("above the header", error.Message);
    }

    [Fact]
    public void A_truncated_gzip_sheet_is_refused_naming_it()
    {
        using var folder = new TempFolder();
        var rows = new StringBuilder("sample,status\n");
        for (int s = 0; s < 4000; s++) rows.Append(FormattableString.Invariant($"s{s},{(s % 2 == 0 ? "x" : "y")}\n"));
        var whole = GzipFile.Compress(Encoding.UTF8.GetBytes(rows.ToString()));
        string samples = folder.File("samples.csv.gz");
        // Cut inside the data: .NET's GZipStream ends silently there, the trailer check must not (RFC 1952, 2.3.1).
        File.WriteAllBytes(samples, whole[..(whole.Length / 2)]);

        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(new PanelLoadOptions { MatrixPath = folder.File("m.csv", Matrix), OutcomeColumn = "status", SampleSheetPath = samples }));

        Assert.StartsWith("samples.csv.gz: ", error.Message);
        Assert.Contains("truncated", error.Message);
    }

    [Fact]
    public void A_gzip_sheet_that_holds_no_text_is_refused_with_the_fix()
    {
        using var folder = new TempFolder();
        string samples = folder.File("samples.csv.gz");
        // Zero bytes, as a compressed spreadsheet workbook would hold.
        File.WriteAllBytes(samples, GzipFile.Compress([0x50, 0x4B, 0x03, 0x04, 0x00, 0x00, 0x00, 0x00]));

        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(new PanelLoadOptions { MatrixPath = folder.File("m.csv", Matrix), OutcomeColumn = "status", SampleSheetPath = samples }));

        Assert.StartsWith("samples.csv.gz: is gzip-compressed but does not hold text", error.Message);
        Assert.Contains("saved as CSV", error.Message);
    }
}
