using OmicsScreen.Data.Assembly;
using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>
/// Rows longer than the fast reader's 16 Mi-character buffer are read again row by row (issue 13,
/// finding 2). That reader must give exactly what the fast one gives: the fast reader is the
/// reference, on files that both can read.
/// </summary>
public sealed class RowByRowReadingTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    public static TheoryData<string, string> Files() => new()
    {
        { "plain.csv", "id,group,a,b\ns1,x,1,2\ns2,y,3.5,-4e-3\ns3,x,NA,<LOD\ns4,y,<0.05,7\n" },
        { "tabs.tsv", "id\tgroup\ta\tb\ns1\tx\t1\t2\ns2\ty\t3\t4\ns3\tx\t5\t6\n" },
        { "crlf and blank lines.csv", "id,group,a,b\r\ns1,x,1,2\r\n\r\ns2,y,3,4\r\n\r\n\r\ns3,x,5,6\r\n" },
        { "quotes.csv", "id,group,\"a, with comma\",\"b \"\"quoted\"\"\"\n\"s1\",x,1,2\ns2,\"y\",\" 3 \",4\ns3,x,5,\"6\"\n" },
        { "no final line break.csv", "id,group,a,b\ns1,x,1,2\ns2,y,3,4" },
        { "spaces.csv", "id , group , a , b \n s1 , x , 1 , 2 \n s2 , y , 3 , 4 \n" },
        { "comments above the header.csv", "# exported 2026-01-01\n# instrument X\nid,group,a,b\ns1,x,1,2\ns2,y,3,4\n" },
        { "note over two lines.csv", "id,group,note,a\ns1,x,\"two\nlines\",1\ns2,y,n,2\ns3,x,n,3\n" },
    };

    [Theory]
    [MemberData(nameof(Files))]
    public void Row_by_row_reading_equals_the_fast_reader(string name, string contents)
    {
        string path = _folder.File(name, contents);
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group", AnnotationColumns = contents.Contains("note") ? ["note"] : [] };
        var fast = DelimitedMatrixReader.Read(path, options, default);
        var rowByRow = DelimitedMatrixReader.ReadLongSamplesInRows(path, options, default);
        AssertSame(fast, rowByRow);
    }

    [Theory]
    [InlineData("id,group,a,b\ns1,x,1,2\ns2,y,3,oops\n")]
    [InlineData("id,group,a,b\ns1,x,1,2\ns2,y,3\n")]
    [InlineData("id,group,a,b\ns1,x,1,2\ns1,y,3,4\n")]
    public void Row_by_row_reading_refuses_a_bad_file_with_the_fast_reader_s_message(string contents)
    {
        string path = _folder.File("bad.csv", contents);
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group" };
        var fast = Assert.Throws<PanelInputException>(() => DelimitedMatrixReader.Read(path, options, default));
        var rowByRow = Assert.Throws<PanelInputException>(() => DelimitedMatrixReader.ReadLongSamplesInRows(path, options, default));
        Assert.Equal(fast.Message, rowByRow.Message);
    }

    public static TheoryData<string, string> FeatureRowFiles() => new()
    {
        { "plain.csv", "feature,s1,s2,s3,s4\ngroup,x,y,x,y\na,1,2,3.5,-4e-3\nb,NA,<LOD,<0.05,7\n" },
        { "tabs.tsv", "feature\ts1\ts2\ts3\ngroup\tx\ty\tx\na\t1\t2\t3\nb\t4\t5\t6\n" },
        { "crlf and blank lines.csv", "feature,s1,s2,s3\r\ngroup,x,y,x\r\n\r\na,1,2,3\r\n\r\n\r\nb,4,5,6\r\n" },
        { "quotes.csv", "feature,\"s1\",s2,\"s 3\"\ngroup,x,\"y\",x\n\"a, with comma\",1,\" 2 \",3\n\"b \"\"quoted\"\"\",4,5,\"6\"\n" },
        { "no final line break.csv", "feature,s1,s2,s3\ngroup,x,y,x\na,1,2,3\nb,4,5,6" },
        { "comments above the header.csv", "# exported 2026-01-01\nfeature,s1,s2,s3\ngroup,x,y,x\na,1,2,3\n" },
        { "attribute row last.csv", "feature,s1,s2,s3\na,1,2,3\nb,4,5,6\ngroup,x,y,x\n" },
    };

    [Theory]
    [MemberData(nameof(FeatureRowFiles))]
    public void Row_by_row_reading_of_features_in_rows_equals_the_fast_reader(string name, string contents)
    {
        string path = _folder.File(name, contents);
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group", Layout = PanelLayout.FeaturesInRows };
        var fast = DelimitedMatrixReader.Read(path, options, default);
        var rowByRow = DelimitedMatrixReader.ReadLongFeaturesInRows(path, options, default);
        AssertSame(fast, rowByRow);
    }

    [Theory]
    [InlineData("feature,s1,s2,s3\ngroup,x,y,x\na,1,2,3\nb,4,oops,6\n")]
    [InlineData("feature,s1,s2,s3\ngroup,x,y,x\na,1,2,3\nb,4,5\n")]
    [InlineData("feature,s1,s2,s3\ngroup,x,y,x\na,1,2,3\na,4,5,6\n")]
    [InlineData("feature,s1,s1,s3\ngroup,x,y,x\na,1,2,3\n")]
    [InlineData("feature,s1,s2,s3\ngroup,x,y,x\ngroup,x,y,x\na,1,2,3\n")]
    [InlineData("feature,s1,s2,s3\ngroup,x,y,x\n")]
    [InlineData("feature\ngroup\n")]
    public void Row_by_row_reading_of_features_in_rows_refuses_a_bad_file_with_the_fast_reader_s_message(string contents)
    {
        string path = _folder.File("bad.csv", contents);
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group", Layout = PanelLayout.FeaturesInRows };
        var fast = Assert.Throws<PanelInputException>(() => DelimitedMatrixReader.Read(path, options, default));
        var rowByRow = Assert.Throws<PanelInputException>(() => DelimitedMatrixReader.ReadLongFeaturesInRows(path, options, default));
        Assert.Equal(fast.Message, rowByRow.Message);
    }

    /// <summary>
    /// A features-in-rows file whose feature rows are each longer than 16 Mi characters (400,000
    /// samples, numbers written with over 40 digits) loads through the public loader, and every cell
    /// holds what .NET's own float parser reads from its text (common practice: round to nearest).
    /// </summary>
    [Fact]
    public void A_features_in_rows_row_longer_than_the_fast_reader_s_buffer_loads_whole()
    {
        const int sampleCount = 400_000;
        string path = Path.Combine(_folder.Path, "long.csv");
        string Cell(int feature, int sample) => sample == 7 && feature == 1 ? "NA"
            : string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{sample % 1000}.{feature}{new string('0', 40)}{sample % 7}");
        using (var writer = new StreamWriter(path))
        {
            writer.Write("feature");
            for (int s = 0; s < sampleCount; s++) writer.Write(string.Create(System.Globalization.CultureInfo.InvariantCulture, $",s{s}"));
            writer.Write("\ngroup");
            for (int s = 0; s < sampleCount; s++) writer.Write(s % 2 == 0 ? ",x" : ",y");
            for (int f = 0; f < 2; f++)
            {
                writer.Write(string.Create(System.Globalization.CultureInfo.InvariantCulture, $"\nf{f}"));
                for (int s = 0; s < sampleCount; s++) writer.Write(',' + Cell(f, s));
            }
            writer.Write('\n');
        }
        // The shortest cell has 44 characters and a delimiter: each feature row is over 17.6 million characters.
        Assert.True(45L * sampleCount > 16 << 20, "each feature row must pass the 16 Mi-character buffer");
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group", Layout = PanelLayout.FeaturesInRows };
        var raw = DelimitedMatrixReader.Read(path, options, default);
        var matrix = raw.Matrix;
        Assert.Equal(["f0", "f1"], matrix.FeatureNames);
        Assert.Equal(sampleCount, matrix.SampleCount);
        Assert.Equal("s399999", matrix.SampleIds[sampleCount - 1]);
        Assert.Equal("y", raw.Annotations["group"][sampleCount - 1]);
        Assert.Equal(CellState.Missing, matrix.State(1, 7));
        foreach (int s in new[] { 0, 1, 6, 8, 12_345, sampleCount - 1 })
            for (int f = 0; f < 2; f++)
            {
                Assert.Equal(CellState.Measured, matrix.State(f, s));
                Assert.Equal(float.Parse(Cell(f, s), System.Globalization.CultureInfo.InvariantCulture), matrix.Value(f, s));
            }
    }

    private static void AssertSame(RawMatrix expected, RawMatrix actual)
    {
        var e = expected.Matrix;
        var a = actual.Matrix;
        Assert.Equal(e.FeatureNames, a.FeatureNames);
        Assert.Equal(e.SampleIds, a.SampleIds);
        Assert.Equal(expected.SampleLines, actual.SampleLines);
        Assert.Equal(expected.OtherColumns, actual.OtherColumns);
        Assert.Equal(expected.Annotations.Keys.Order(), actual.Annotations.Keys.Order());
        foreach (var (column, values) in expected.Annotations) Assert.Equal(values, actual.Annotations[column]);
        for (int f = 0; f < e.FeatureCount; f++)
            for (int s = 0; s < e.SampleCount; s++)
            {
                Assert.Equal(e.State(f, s), a.State(f, s));
                Assert.Equal(BitConverter.SingleToInt32Bits(e.Value(f, s)), BitConverter.SingleToInt32Bits(a.Value(f, s)));
            }
    }
}
