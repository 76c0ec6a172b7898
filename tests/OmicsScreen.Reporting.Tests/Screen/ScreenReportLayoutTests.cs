using System.Diagnostics;
using System.Text.RegularExpressions;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Tests.Support;
using OmicsScreen.TestSupport.ExternalTools;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// Issue 14: the report's tables fit a 1,280-pixel window and an A4 page. Headless Chromium lays
/// the page out; for the window, a measuring script is added to a copy of the page (the report
/// itself has no script and forbids one); for paper, Chromium prints to PDF and pdftotext
/// (poppler-utils) gives each page's text.
/// </summary>
public sealed partial class ScreenReportLayoutTests : IDisposable
{
    private readonly string _directory = Directory.CreateTempSubdirectory("omicsscreen-report-layout-").FullName;

    public void Dispose()
    {
        try { Directory.Delete(_directory, recursive: true); }
        catch (IOException) { } // a browser helper process may still hold its profile for a moment
    }

    [GeneratedRegex("<meta http-equiv=\"Content-Security-Policy\"[^>]*/>")]
    private static partial Regex PolicyMeta();

    /// <summary>Marks on the body every table whose right edge passes the main column or the window.</summary>
    private const string MeasuringScript = """
        <script>
        var main = document.querySelector('main').getBoundingClientRect();
        var wide = [];
        document.querySelectorAll('table').forEach(function (table) {
          var box = table.getBoundingClientRect();
          if (box.right > main.right + 1 || box.right > document.documentElement.clientWidth) {
            wide.push((table.caption ? table.caption.textContent : 'table') + ' ' + Math.round(box.width) + 'px');
          }
        });
        document.body.setAttribute('data-wide-tables', wide.join(' | '));
        document.body.setAttribute('data-viewport', String(document.documentElement.clientWidth));
        </script>
        """;

    /// <summary>The captions (and widths) of the tables wider than the page at 1,280 pixels.</summary>
    private string WideTables(string html, string name)
    {
        string measured = PolicyMeta().Replace(html, "").Replace("</body>", MeasuringScript + "</body>");
        string path = Path.Combine(_directory, name + ".html");
        File.WriteAllText(path, measured);
        string dom = HeadlessChromium.Run(Path.Combine(_directory, "profile-" + name), "--window-size=1280,900", "--dump-dom", new Uri(path).AbsoluteUri);
        var viewport = Regex.Match(dom, "data-viewport=\"(\\d+)\"");
        Assert.True(viewport.Success, "the measuring script did not run");
        Assert.Equal("1280", viewport.Groups[1].Value);
        var wide = Regex.Match(dom, "data-wide-tables=\"([^\"]*)\"");
        Assert.True(wide.Success);
        return wide.Groups[1].Value;
    }

    [RequiresToolFact(ExternalTool.Chromium)]
    public void Width_check_catches_a_table_wider_than_the_page()
    {
        ExternalTools.Require(ExternalTool.Chromium);
        // Control for the test below: sixteen unbreakable numeric columns cannot fit.
        var columns = Enumerable.Range(1, 16).Select(i => new HtmlTableColumn("Column " + i, ColumnAlignment.Numeric)).ToArray();
        var table = new HtmlTable("Too wide", columns);
        table.AddRow(Enumerable.Range(1, 16).Select(_ => "123456.789 [123.4, 567.8]").ToArray());
        string html = new HtmlBuilder().BeginDocument("Control").Table(table).EndDocument();

        Assert.StartsWith("Too wide", WideTables(html, "control"));
    }

    [RequiresToolFact(ExternalTool.Chromium)]
    public void No_table_is_wider_than_a_1280_pixel_window()
    {
        ExternalTools.Require(ExternalTool.Chromium);
        // Real paths and digests are long unbroken strings: the file tables must wrap them.
        var input = ScreenReportSample.Input() with
        {
            Inputs = [new ReportedFile("matrix", "/data/projects/plasma-discovery-2026/exports/olink_explore_3072_normalised_npx_matrix_v2.csv",
                "3f8a0c2e9b1d4f6a8c0e2b4d6f8a0c2e9b1d4f6a8c0e2b4d6f8a0c2e9b1d4f6a")],
        };
        string wide = WideTables(ScreenReport.Render(input), "report");
        Assert.True(wide.Length == 0, "Tables wider than the page: " + wide);
    }

    [RequiresToolFact(ExternalTool.Chromium, ExternalTool.PdfToText)]
    public void Printed_on_A4_every_shortlist_header_is_on_the_page_of_its_table()
    {
        ExternalTools.Require(ExternalTool.Chromium, ExternalTool.PdfToText);
        string path = Path.Combine(_directory, "report.html");
        File.WriteAllText(path, ScreenReport.Render(ScreenReportSample.Input()));
        string pdf = Path.Combine(_directory, "report.pdf");
        HeadlessChromium.Run(Path.Combine(_directory, "profile-print"), "--no-pdf-header-footer", "--print-to-pdf=" + pdf, new Uri(path).AbsoluteUri);
        var pages = PdfPages(pdf);
        Assert.True(pages.Count > 1, "the report printed on a single page");

        foreach (var (caption, headers) in new[]
                 {
                     (ScreenReportTables.ShortlistCaption, new[] { "Rank", "Feature", "Group", "Selection frequency", "Median rank [IQR]",
                         "Corrected importance ± SD", "Permutation importance ± SD", "q-value" }),
                     (ScreenReportTables.ShortlistStatisticsCaption, new[] { "Rank", "Feature", "Direction", "log2 ratio", "AUC [95% CI]", "Univariate rank" }),
                 })
        {
            int page = pages.FindIndex(p => p.Contains(caption + " ", StringComparison.Ordinal) || p.EndsWith(caption, StringComparison.Ordinal));
            Assert.True(page >= 0, $"caption '{caption}' not found in the PDF text");
            foreach (var header in headers)
                Assert.True(pages[page].Contains(header, StringComparison.Ordinal), $"'{header}' is not on page {page + 1} with '{caption}':\n{pages[page]}");
        }
    }

    /// <summary>Each page's text with runs of white space made single spaces, so a header wrapped over two lines still reads as one phrase.</summary>
    private static List<string> PdfPages(string pdf)
    {
        var start = new ProcessStartInfo("pdftotext") { RedirectStandardOutput = true, UseShellExecute = false };
        start.ArgumentList.Add("-raw");
        start.ArgumentList.Add(pdf);
        start.ArgumentList.Add("-");
        using var process = Process.Start(start)!;
        string text = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        Assert.Equal(0, process.ExitCode);
        return text.Split('\f').Select(page => Regex.Replace(page, "\\s+", " ").Trim()).ToList();
    }
}
