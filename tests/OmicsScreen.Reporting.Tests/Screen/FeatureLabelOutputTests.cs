using OmicsScreen.Reporting.Screen;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// Display names and annotations from the inputs reach the tables and the report, the lab-facing
/// name first with the id beside it, and are treated as the untrusted data they are.
/// </summary>
public class FeatureLabelOutputTests
{
    private const string HostileDisplay = "<img src=x onerror=alert(1)>IL";
    private const string FormulaAnnotation = "=HYPERLINK(\"http://x\")";

    private static FeatureLabels Labels()
    {
        int count = ScreenReportSample.Panel.FeatureCount;
        var display = Enumerable.Range(0, count).Select(f => f % 2 == 0 ? $"{HostileDisplay}-{f}" : "").ToArray();
        var annotation = Enumerable.Range(0, count).Select(f => f % 3 == 0 ? FormulaAnnotation : $"panel {f}").ToArray();
        // "q_value" is a column of the features table already: the annotation must not collide with it.
        return new FeatureLabels(display, [new("assay_panel", annotation), new("q_value", annotation)]);
    }

    [Fact]
    public void Tables_carry_the_display_name_after_the_id_and_the_annotations_at_the_end_formulas_neutralised()
    {
        var result = ScreenReportSample.Result;
        var writer = new StringWriter();

        ScreenTables.WriteFeatures(writer, result, Labels());

        var lines = writer.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var header = lines[0].Split('\t');
        Assert.Equal("display_name", header[Array.IndexOf(header, "feature") + 1]);
        Assert.Equal(["assay_panel", "feature_q_value"], header[^2..]);
        var first = lines[1].Split('\t');
        int index = result.Order[0];
        Assert.Equal(index % 2 == 0 ? $"{HostileDisplay}-{index}" : "", first[Array.IndexOf(header, "display_name")]);
        // OWASP CSV injection guidance (common practice): a cell starting with = is prefixed with a quote.
        foreach (var line in lines.Skip(1))
            Assert.DoesNotContain(line.Split('\t')[^2..], cell => cell.StartsWith('='));
    }

    [Fact]
    public void The_report_shows_the_lab_facing_name_first_with_the_id_beside_it_escaped()
    {
        var labels = Labels();
        var html = ScreenReport.Render(ScreenReportSample.Input() with { Labels = labels });
        var top = ScreenReportSample.Result.Shortlist.First(e => labels.DisplayName(e.Forest.FeatureIndex).Length > 0);

        Assert.DoesNotContain("<img src=x", html);
        // HTML escaping of < and > (HTML Living Standard, common practice), then " (" and the id, itself escaped.
        string expected = System.Net.WebUtility.HtmlEncode($"{HostileDisplay}-{top.Forest.FeatureIndex} (") ;
        Assert.Contains(expected.Replace("&#39;", "'"), html.Replace("&#39;", "'"));
        Assert.Contains("Marker (feature id)", html);
    }
}
