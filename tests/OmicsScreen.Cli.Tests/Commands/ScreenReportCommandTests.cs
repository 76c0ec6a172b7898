using System.Text.Json;
using System.Text.RegularExpressions;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// `screen` writes the HTML report into its results folder. The panel is the open Wisconsin
/// breast cancer data (UCI, Wolberg, Street &amp; Mangasarian 1995; provenance in the reference
/// folder's README), whose sample ids S0001..S0569 must stay out of the report unless asked for.
/// </summary>
public sealed partial class ScreenReportCommandTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static readonly string[] QuickSettings =
        ["--pairs", "2", "--trees", "40", "--curve-folds", "2", "--curve-inner-pairs", "1", "--max-panel-size", "4", "--quiet"];

    private string[] ScreenWdbc(string outFolder, params string[] extra) =>
        ["screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--out", outFolder, .. QuickSettings, .. extra];

    [GeneratedRegex(@"\bS0[0-9]{3}\b")]
    private static partial Regex WdbcSampleId();

    [Fact]
    public void Screen_writes_report_html_before_the_manifest_and_names_it_in_the_summary()
    {
        string results = Path.Combine(_folder.Path, "results");
        var run = CliHarness.Run(ScreenWdbc(results));

        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        string report = Path.Combine(results, "report.html");
        Assert.True(File.Exists(report));
        Assert.Contains("Report: " + report, run.Out);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(results, "manifest.json")));
        var outputs = manifest.RootElement.GetProperty("outputs").EnumerateArray().Select(o => o.GetString()).ToList();
        Assert.Contains("report.html", outputs);
        Assert.DoesNotContain("manifest.json", outputs);

        string html = File.ReadAllText(report);
        Assert.StartsWith("<!DOCTYPE html>", html);
        Assert.Contains("malignant", html);
        Assert.Contains(manifest.RootElement.GetProperty("inputs")[0].GetProperty("sha256").GetString()!, html);
        Assert.DoesNotMatch(WdbcSampleId(), html);
    }

    [Fact]
    public void Show_sample_ids_lets_the_sample_ids_into_the_report()
    {
        string results = Path.Combine(_folder.Path, "with-ids");
        var run = CliHarness.Run(ScreenWdbc(results, "--show-sample-ids"));

        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Matches(WdbcSampleId(), File.ReadAllText(Path.Combine(results, "report.html")));
    }
}
