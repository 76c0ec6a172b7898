using System.Globalization;
using System.Text;
using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>
/// Text rows are parsed on several threads in batches; values must land in file order and errors
/// must name the first bad line of the file, exactly, whatever the thread timing.
/// </summary>
public sealed class ParallelParsingTests : IDisposable
{
    private const int SampleCount = 3000;
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>Row i (line i + 2, or later after the multi-line note) holds feature values i and -i.</summary>
    private string WritePanel(string name, Func<int, string>? secondCell = null)
    {
        var text = new StringBuilder("id,group,note,a,b\n");
        for (int i = 0; i < SampleCount; i++)
        {
            string note = i == 700 ? "\"two\nlines\"" : "n";
            string b = secondCell?.Invoke(i) ?? (-i).ToString(CultureInfo.InvariantCulture);
            text.Append(CultureInfo.InvariantCulture, $"s{i},{(i % 2 == 0 ? "x" : "y")},{note},{i},{b}\n");
        }
        return _folder.File(name, text.ToString());
    }

    private static PanelLoadOptions Options(string path) =>
        new() { MatrixPath = path, OutcomeColumn = "group", AnnotationColumns = ["note"] };

    [Fact]
    public void Thousands_of_rows_load_in_file_order()
    {
        var panel = PanelLoader.Load(Options(WritePanel("many.csv"))).Panel;
        Assert.Equal(SampleCount, panel.SampleCount);
        for (int i = 0; i < SampleCount; i++)
        {
            Assert.Equal($"s{i}", panel.Matrix.SampleIds[i]);
            Assert.Equal(i, panel.Matrix.Value(0, i));
            Assert.Equal(-i, panel.Matrix.Value(1, i));
        }
        Assert.Equal("two\nlines", panel.ExtraColumns["note"][700]);
    }

    [Fact]
    public void The_first_bad_line_is_reported_with_its_exact_number()
    {
        // Row i starts on line i + 2, plus one after the quoted line break of row 700.
        var path = WritePanel("bad.csv", i => i is 2500 or 2900 ? "oops" + i : "1");
        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));
        Assert.Equal(2503, error.Line);
        Assert.Contains("bad.csv, line 2503, column 'b'", error.Message);
        Assert.Contains("found 'oops2500'", error.Message);
    }

    [Fact]
    public void A_row_after_a_quoted_line_break_reports_the_line_it_starts_on()
    {
        var path = WritePanel("quoted.csv", i => i == 700 ? "bad" : "1");
        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));
        Assert.Equal(702, error.Line);
    }

    [Fact]
    public void A_cancelled_load_stops_with_operation_cancelled()
    {
        var path = WritePanel("cancel.csv");
        using var cancellation = new CancellationTokenSource();
        cancellation.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() => PanelLoader.Load(Options(path), cancellation.Token));
    }
}
