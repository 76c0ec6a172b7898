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
        string path = _folder.Write(name, contents);
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
        string path = _folder.Write("bad.csv", contents);
        var options = new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group" };
        var fast = Assert.Throws<PanelInputException>(() => DelimitedMatrixReader.Read(path, options, default));
        var rowByRow = Assert.Throws<PanelInputException>(() => DelimitedMatrixReader.ReadLongSamplesInRows(path, options, default));
        Assert.Equal(fast.Message, rowByRow.Message);
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
