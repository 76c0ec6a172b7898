using System.Text;
using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Text;

public sealed class DelimitedTextTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private LoadedPanel Load(string name, string content, PanelLayout layout = PanelLayout.SamplesInRows) =>
        PanelLoader.Load(new PanelLoadOptions { MatrixPath = _folder.File(name, content), OutcomeColumn = "group", Layout = layout });

    [Theory]
    [InlineData(",", "comma")]
    [InlineData("\t", "tab")]
    [InlineData(";", "semicolon")]
    public void Delimiter_is_detected_from_the_header_and_reported(string delimiter, string reported)
    {
        var content = string.Join(delimiter, "id", "group", "a", "b") + "\n"
            + string.Join(delimiter, "s1", "x", "1.5", "2") + "\n"
            + string.Join(delimiter, "s2", "y", "3", "4.25") + "\n";
        var loaded = Load("panel.txt", content);

        Assert.Equal(reported, loaded.Inspection.Delimiter);
        Assert.Equal(["a", "b"], loaded.Panel.Matrix.FeatureNames);
        Assert.Equal(4.25f, loaded.Panel.Matrix.Value(1, 1));
    }

    [Fact]
    public void Byte_order_mark_does_not_become_part_of_the_first_column_name()
    {
        var path = _folder.File("bom.csv");
        File.WriteAllText(path, "id,group,a\nx1,x,1\ny2,y,2\n", new UTF8Encoding(encoderShouldEmitUTF8Identifier: true));
        Assert.Equal(0xEF, File.ReadAllBytes(path)[0]);

        var loaded = PanelLoader.Load(new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "group", SampleIdColumn = "id" });

        Assert.Equal(["x1", "y2"], loaded.Panel.Matrix.SampleIds);
        Assert.Equal(["a"], loaded.Panel.Matrix.FeatureNames);
    }

    [Fact]
    public void Crlf_line_endings_give_the_same_values_and_line_numbers_as_lf()
    {
        var lf = Load("lf.csv", "id,group,a\ns1,x,1\ns2,y,2\n");
        var crlf = Load("crlf.csv", "id,group,a\r\ns1,x,1\r\ns2,y,2\r\n");
        PanelAssert.Identical(lf.Panel, crlf.Panel);

        var error = Assert.Throws<PanelInputException>(() => Load("bad.csv", "id,group,a\r\ns1,x,1\r\ns2,y,oops\r\n"));
        Assert.Equal(3, error.Line);
    }

    [Fact]
    public void Quoted_fields_keep_embedded_delimiters_and_quotes()
    {
        var loaded = PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = _folder.File("quoted.csv",
                "id,group,note,\"IL-6, serum\",\"TNF \"\"alpha\"\"\"\n\"s,1\",x,\"a, \"\"b\"\"\",1,\"2.5\"\ns2,y,plain,3,4\n"),
            OutcomeColumn = "group",
            AnnotationColumns = ["note"],
        });
        Assert.Equal(["IL-6, serum", "TNF \"alpha\""], loaded.Panel.Matrix.FeatureNames);
        Assert.Equal(["s,1", "s2"], loaded.Panel.Matrix.SampleIds);
        Assert.Equal(["a, \"b\"", "plain"], loaded.Panel.ExtraColumns["note"]);
        Assert.Equal(2.5f, loaded.Panel.Matrix.Value(1, 0));
    }

    [Fact]
    public void Missing_and_censored_tokens_become_cell_states()
    {
        var loaded = Load("tokens.tsv",
            "id\tgroup\ta\tb\n" +
            "s1\tx\tNA\t<LOD\n" +
            "s2\tx\t\t<0.05\n" +
            "s3\ty\tnull\tBLQ\n" +
            "s4\ty\t2\t<LLOQ\n" +
            "s5\tx\tNaN\tBLOD\n" +
            "s6\ty\tN/A\t<LOQ\n");
        var matrix = loaded.Panel.Matrix;
        for (int s = 0; s < 6; s++)
        {
            Assert.Equal(s == 3 ? CellState.Measured : CellState.Missing, matrix.State(0, s));
            Assert.Equal(CellState.BelowDetection, matrix.State(1, s));
        }
        Assert.Equal(0.05f, matrix.Value(1, 1));
        Assert.True(float.IsNaN(matrix.Value(1, 0)));
        Assert.Equal(6, loaded.Inspection.BelowDetectionCellCount);
        Assert.Equal(5.0 / 12.0, loaded.Inspection.MissingFraction, 12);
    }

    [Fact]
    public void Features_in_rows_take_sample_attributes_from_labelled_rows()
    {
        var loaded = Load("rows.csv", "protein,s1,s2,s3\ngroup,x,y,x\nIL6,1,2,3\nCRP,4,NA,<1\n", PanelLayout.FeaturesInRows);
        var matrix = loaded.Panel.Matrix;
        Assert.Equal(["s1", "s2", "s3"], matrix.SampleIds);
        Assert.Equal(["IL6", "CRP"], matrix.FeatureNames);
        Assert.Equal([0, 1, 0], loaded.Panel.Outcome.SampleClasses.ToArray());
        Assert.Equal(CellState.Missing, matrix.State(1, 1));
        Assert.Equal(CellState.BelowDetection, matrix.State(1, 2));
        Assert.Equal(1f, matrix.Value(1, 2));
        Assert.Equal(PanelLayout.FeaturesInRows, loaded.Inspection.Layout);
    }

    [Fact]
    public void Blank_lines_and_a_missing_final_newline_are_tolerated()
    {
        var loaded = Load("blank.csv", "id,group,a\n\ns1,x,1\n\ns2,y,2");
        Assert.Equal(["s1", "s2"], loaded.Panel.Matrix.SampleIds);
        Assert.Equal(2f, loaded.Panel.Matrix.Value(0, 1));
    }

    [Fact]
    public void Sample_id_column_can_be_named_and_need_not_be_first()
    {
        var loaded = PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = _folder.File("named.csv", "a,group,sample,b\n1,x,s1,2\n3,y,s2,4\n"),
            OutcomeColumn = "group",
            SampleIdColumn = "sample",
        });
        Assert.Equal(["s1", "s2"], loaded.Panel.Matrix.SampleIds);
        Assert.Equal(["a", "b"], loaded.Panel.Matrix.FeatureNames);
    }
}
