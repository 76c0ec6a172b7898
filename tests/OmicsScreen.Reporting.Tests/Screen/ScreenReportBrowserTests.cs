using System.Text.RegularExpressions;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Tests.Support;
using OmicsScreen.TestSupport.ExternalTools;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// The screen report opened in headless Chromium with every network path closed. CI installs
/// Chromium (.ci/install-packages), so there a missing browser fails the test; elsewhere the test
/// returns early.
/// </summary>
public sealed class ScreenReportBrowserTests : IDisposable
{
    private readonly string _directory = Directory.CreateTempSubdirectory("omicsscreen-screen-report-").FullName;

    public void Dispose()
    {
        try { Directory.Delete(_directory, recursive: true); }
        catch (IOException) { } // a browser helper process may still hold its profile for a moment
    }

    private string WritePage(string name, string html)
    {
        string path = Path.Combine(_directory, name);
        File.WriteAllText(path, html, new System.Text.UTF8Encoding(false));
        return new Uri(path).AbsoluteUri;
    }

    /// <summary>Dumps the DOM with Chromium's log on; returns the DOM and the log's console lines (script errors, blocked loads).</summary>
    private (string Dom, List<string> ConsoleLines) Open(string url, string profile)
    {
        string log = Path.Combine(_directory, profile + ".log");
        string dom = HeadlessChromium.Run(Path.Combine(_directory, profile), "--enable-logging", "--v=0", "--log-file=" + log, "--dump-dom", url);
        var lines = File.Exists(log)
            ? File.ReadAllLines(log).Where(l => l.Contains(":CONSOLE", StringComparison.Ordinal) || l.Contains("Uncaught", StringComparison.Ordinal)).ToList()
            : [];
        return (dom, lines);
    }

    [RequiresToolFact(ExternalTool.Chromium)]
    public void Console_check_catches_a_blocked_network_request()
    {
        ExternalTools.Require(ExternalTool.Chromium);
        // Control for the test below: a page under the report's policy that asks for a remote image must leave a console line.
        string page = "<!DOCTYPE html><html><head><meta http-equiv=\"Content-Security-Policy\" content=\"" + HtmlBuilder.ContentSecurityPolicy.Replace("'", "&#39;")
            + "\"/></head><body><img src=\"http://example.invalid/x.png\"/></body></html>";

        var (_, console) = Open(WritePage("control.html", page), "profile-control");

        Assert.NotEmpty(console);
    }

    [RequiresToolFact(ExternalTool.Chromium)]
    public void Browser_shows_the_report_without_console_errors_or_network_requests()
    {
        ExternalTools.Require(ExternalTool.Chromium);
        var result = ScreenReportSample.Result;
        var (dom, console) = Open(WritePage("report.html", ScreenReport.Render(ScreenReportSample.Input())), "profile-dom");

        Assert.True(console.Count == 0, string.Join('\n', console));
        Assert.DoesNotMatch("<script", dom);
        foreach (var label in new[]
                 {
                     ScreenReportCharts.CorrectedAxisLabel, ScreenReportCharts.PermutationAxisLabel, ScreenReportCharts.OrderAxisLabel,
                     ScreenReportCharts.FrequencyAxisLabel, ScreenReportCharts.TreesAxisLabel, ScreenReportCharts.ErrorAxisLabel,
                     ScreenReportCharts.PanelSizeAxisLabel, ScreenReportCharts.PanelSizeScoreLabel(result.PanelSize!), ScreenReportCharts.ClassAxisLabel,
                 })
            Assert.Contains(">" + MarkupText.Encode(label) + "<", dom);

        // The shortlist table: the one whose caption names it; one body row per shortlisted marker.
        var table = Regex.Match(dom, "<caption>" + Regex.Escape(ScreenReportTables.ShortlistCaption) + "</caption>.*?</tbody>", RegexOptions.Singleline);
        Assert.True(table.Success);
        Assert.Equal(result.Shortlist.Count + 1, Regex.Matches(table.Value, "<tr>").Count); // + header row
    }

    [RequiresToolFact(ExternalTool.Chromium)]
    public void Browser_screenshot_of_the_report_is_not_blank()
    {
        ExternalTools.Require(ExternalTool.Chromium);
        string screenshot = Path.Combine(_directory, "report.png");
        string url = WritePage("report.html", ScreenReport.Render(ScreenReportSample.Input()));
        HeadlessChromium.Run(Path.Combine(_directory, "profile-shot"), "--screenshot=" + screenshot, "--window-size=1200,1600", url);

        var image = PngImage.Decode(File.ReadAllBytes(screenshot));
        Assert.Equal((1200, 1600), (image.Width, image.Height));
        // Text, the caution box and table shading give many distinct colours; a blank page has one.
        Assert.True(image.DistinctColours() > 20, $"Only {image.DistinctColours()} distinct colours in the screenshot.");
    }
}
