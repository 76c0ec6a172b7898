using System.Xml.Linq;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Tests.Support;
using OmicsScreen.Screening.Covariates;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// The report's own shortlist table carries the covariates a marker only tracks (as shortlist.tsv
/// does), with a hostile covariate name shown as plain text; covariate_association.tsv names the
/// outcome kind's importance loss.
/// </summary>
public class TrackingOutputTests
{
    private const string HostileCovariate = "<b>age</b>&\"x\"";

    /// <summary>A hand-built tracking record: the first shortlisted marker tracks the hostile covariate, the others nothing.</summary>
    private static CovariateTracking Tracking(string loss)
    {
        var shortlist = ScreenReportSample.Result.Shortlist;
        var markers = shortlist.Select((e, i) => new MarkerTracking(e.Forest.FeatureIndex, e.Forest.Feature, 0.05, [i == 0 ? 0.001 : 0.04],
            i == 0 ? [HostileCovariate] : [])).ToList();
        var associations = shortlist.Select(e => new MarkerCovariateAssociation(e.Forest.FeatureIndex, e.Forest.Feature, HostileCovariate,
            "spearman", 0.7, 1e-6, 1e-5)).ToList();
        return new CovariateTracking([HostileCovariate], associations, markers, 0.002, [0.002], 20, 40) { Loss = loss };
    }

    [Fact]
    public void The_shortlist_table_names_the_covariate_a_marker_only_tracks_as_plain_text()
    {
        var result = ScreenReportSample.Result with { CovariateTracking = Tracking("squared_error_rise") };
        string html = ScreenReport.Render(ScreenReportSample.Input(result: result));
        var document = Markup.Parse(html);

        var table = Markup.Elements(document, "table")
            .Single(t => Markup.Elements(new XDocument(t), "caption").Single().Value == ScreenReportTables.ShortlistCaption);
        var headers = Markup.Elements(new XDocument(table), "th").Select(h => h.Value).ToList();
        int column = headers.IndexOf(ScreenReportTables.TracksHeader);
        Assert.True(column > 0, string.Join(" | ", headers));
        var rows = table.Descendants().Single(e => e.Name.LocalName == "tbody").Elements().ToList();
        Assert.Equal(result.Shortlist.Count, rows.Count);
        // The cell's text is the name itself (the XML parser decodes the escaped markup), and the
        // raw name never appears unescaped in the page (common practice: HTML escaping of data).
        Assert.Equal(HostileCovariate, rows[0].Elements().ElementAt(column).Value);
        Assert.All(rows.Skip(1), r => Assert.Equal("", r.Elements().ElementAt(column).Value));
        Assert.DoesNotContain("<b>age</b>", html);
        Assert.Contains("rise in squared error", html);
    }

    [Fact]
    public void Without_covariates_the_shortlist_table_has_no_tracks_column()
    {
        var document = Markup.Parse(ScreenReport.Render(ScreenReportSample.Input()));
        var table = Markup.Elements(document, "table")
            .Single(t => Markup.Elements(new XDocument(t), "caption").Single().Value == ScreenReportTables.ShortlistCaption);
        Assert.DoesNotContain(ScreenReportTables.TracksHeader, Markup.Elements(new XDocument(table), "th").Select(h => h.Value));
    }

    [Fact]
    public void The_association_table_names_the_importance_loss_of_the_outcome_kind()
    {
        var writer = new StringWriter();
        CovariateTrackingTables.Write(writer, Tracking("concordance_drop"));
        var lines = writer.ToString().TrimEnd('\n').Split('\n');
        int column = Array.IndexOf(lines[0].Split('\t'), "importance_loss");
        Assert.True(column > 0, lines[0]);
        Assert.All(lines.Skip(1), l => Assert.Equal("concordance_drop", l.Split('\t')[column]));
    }
}
