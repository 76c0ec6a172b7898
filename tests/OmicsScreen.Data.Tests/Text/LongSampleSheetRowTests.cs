using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>A sample sheet row past the text reader's 16 Mi-character buffer is an input error with the fix, not an internal error (issue 13).</summary>
public sealed class LongSampleSheetRowTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void A_quote_that_is_never_closed_in_a_sample_sheet_is_named_with_the_fix()
    {
        string matrix = _folder.File("m.csv", "sample_id,F1,F2\ns1,1,2\ns2,3,4\n");
        // An opening quote with no close turns the rest of the file (over 16 Mi characters) into one row.
        string sheet = Path.Combine(_folder.Path, "sheet.csv");
        using (var writer = new StreamWriter(sheet))
        {
            writer.Write("sample_id,status\ns1,\"case\ns2,control\n");
            var filler = new string('x', 1 << 20);
            for (int i = 0; i < 17; i++) writer.Write(filler);
            writer.Write('\n');
        }
        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(new PanelLoadOptions { MatrixPath = matrix, SampleSheetPath = sheet, OutcomeColumn = "status" }));
        Assert.Contains("sheet.csv", error.Message);
        Assert.Contains("quote that is never closed", error.Message);
    }
}
