using System.Text.RegularExpressions;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Reporting.Tests.Support;
using OmicsScreen.TestSupport.ExternalTools;

namespace OmicsScreen.Reporting.Tests.Rendering;

/// <summary>
/// Opens the sample report in a real browser engine. CI installs Chromium (.ci/install-packages), so
/// there a missing browser fails the test; on a developer machine without it the test returns early.
/// </summary>
public sealed class HeadlessRenderingTests : IDisposable
{
    private readonly string _directory = Directory.CreateTempSubdirectory("omicsscreen-report-").FullName;

    public void Dispose()
    {
        try { Directory.Delete(_directory, recursive: true); }
        catch (IOException) { } // a browser helper process may still hold its profile for a moment
    }

    private string WriteReport()
    {
        string path = Path.Combine(_directory, "report.html");
        File.WriteAllText(path, SampleReport.Build(), new System.Text.UTF8Encoding(false));
        return new Uri(path).AbsoluteUri;
    }

    [RequiresToolFact(ExternalTool.Chromium)]
    public void Browser_dom_shows_every_axis_label_and_table_row_and_runs_no_script()
    {
        ExternalTools.Require(ExternalTool.Chromium);
        string dom = HeadlessChromium.Run(Path.Combine(_directory, "profile-dom"), "--dump-dom", WriteReport());

        foreach (var label in SampleReport.AxisLabels) Assert.Contains(">" + label + "<", dom);
        foreach (var cell in SampleReport.TableFeatureCells)
            Assert.Contains("<th scope=\"row\">" + HtmlSerialisedText(cell) + "</th>", dom);
        Assert.Equal(1 + SampleReport.TableFeatureCells.Length, Regex.Matches(dom, "<tr>").Count);
        Assert.Equal(SampleReport.Charts().Count, Regex.Matches(dom, "<svg ").Count);
        // The hostile name stays text: the browser built no script element from it.
        Assert.DoesNotMatch("<script", dom);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;", dom);
    }

    [RequiresToolFact(ExternalTool.Chromium)]
    public void Browser_screenshot_of_the_report_is_not_blank()
    {
        ExternalTools.Require(ExternalTool.Chromium);
        string screenshot = Path.Combine(_directory, "report.png");
        HeadlessChromium.Run(Path.Combine(_directory, "profile-shot"), "--screenshot=" + screenshot, "--window-size=1000,1400", WriteReport());

        var image = PngImage.Decode(File.ReadAllBytes(screenshot));
        Assert.Equal((1000, 1400), (image.Width, image.Height));
        // Text, the caution box and chart colours give many distinct colours; a blank page has one.
        Assert.True(image.DistinctColours() > 20, $"Only {image.DistinctColours()} distinct colours in the screenshot.");
    }

    // The HTML serialisation algorithm (WHATWG HTML, "serialising HTML fragments") escapes &, < and > in
    // text, and non-breaking spaces; quotes stay as they are. Reuses the encoder and undoes the quotes.
    private static string HtmlSerialisedText(string text) =>
        MarkupText.Encode(text).Replace("&quot;", "\"", StringComparison.Ordinal).Replace("&#39;", "'", StringComparison.Ordinal);
}
