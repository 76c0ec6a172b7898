using System.Xml.Linq;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Tests.Support;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// The report's cohort section, rendered from a real small screen of three cohorts with hostile
/// cohort names, a planted cohort-only artefact and markers whose class effect holds in every cohort.
/// </summary>
public sealed class CohortReportTests
{
    private const string Hostile = "<b>north</b>";
    private const string Formula = "=1+1";
    private const string ArtefactName = "artefact-AN";
    private const string ConsistentName = "consistent-CM";
    private const int Artefact = 0, Consistent = 1, Second = 2;

    private static readonly string[] CohortNames = [Formula, "south", Hostile];

    private static readonly Lazy<(Panel Panel, ScreenResult Result)> Screened = new(Screen);

    private static readonly Lazy<string> Report = new(() => ScreenReport.Render(Input(Screened.Value.Result)));

    /// <summary>
    /// Three cohorts of 60 with case shares 25%, 25% and 60% (outcome and cohort associated, not
    /// confounded), 150 features: feature 0 shifted 2.5 SD in the third cohort only (no class effect),
    /// features 1 and 2 shifted 1.5 and 1.2 SD in the cases of every cohort, the rest noise.
    /// </summary>
    private static (Panel, ScreenResult) Screen()
    {
        var panel = CohortPanel.Generate(new CohortPanel.Design
        {
            SamplesPerCohort = 60,
            FeatureCount = 150,
            CohortNames = CohortNames,
            Effects =
            [
                new CohortPanel.PlantedEffect(Artefact, 2.5, CasesOnly: false, OnlyCohort: 2),
                new CohortPanel.PlantedEffect(Consistent, 1.5, CasesOnly: true),
                new CohortPanel.PlantedEffect(Second, 1.2, CasesOnly: true),
            ],
            FeatureNames = new Dictionary<int, string> { [Artefact] = ArtefactName, [Consistent] = ConsistentName },
            SampleIdPrefix = "SAMPLE-ID-",
            Seed = 21,
        });
        var options = new ScreenOptions
        {
            Seed = 5, HalfSamplePairs = 5, TreesPerForest = 100, CurveFolds = 3, CurveInnerPairs = 2, CurveMaxPanelSize = 4,
        };
        return (panel, ScreenRunner.Run(panel, options));
    }

    private static ScreenReportInput Input(ScreenResult result) => new(
        Screened.Value.Panel, result,
        [new ReportedFile("matrix", "panel.csv", new string('a', 64))], "samples in rows",
        [new ReportedFile("result table", "cohort_markers.tsv", new string('c', 64))],
        "omicsscreen screen panel.csv --cohort centre", "0.1.0-test",
        new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero), new DateTimeOffset(2026, 1, 2, 3, 5, 6, TimeSpan.Zero),
        LoadSeconds: 0.1, Cores: 2, Threads: 2);

    private static List<string> Headings(XDocument document) =>
        document.Descendants().Where(e => e.Name.LocalName is "h2" or "h3" or "h4").Select(e => e.Value).ToList();

    private static XElement? TableStartingWith(XDocument document, string caption) =>
        Markup.Elements(document, "table").SingleOrDefault(t => t.Elements().First().Value.StartsWith(caption, StringComparison.Ordinal));

    private static List<List<string>> BodyCells(XElement table) =>
        table.Descendants().Single(e => e.Name.LocalName == "tbody").Elements()
            .Select(row => row.Elements().Select(cell => cell.Value).ToList()).ToList();

    [Fact]
    public void A_screen_with_cohorts_has_the_cohorts_section_between_the_figures_and_reproducibility()
    {
        var headings = Headings(Markup.Parse(Report.Value));

        int figures = headings.IndexOf("Figures"), cohorts = headings.IndexOf(CohortReportSection.Heading), reproducibility = headings.IndexOf("Reproducibility");
        Assert.True(figures >= 0 && cohorts > figures && reproducibility > cohorts, string.Join(" | ", headings));
        string text = string.Join("\n", Markup.Texts(Markup.Parse(Report.Value), "p"));
        Assert.Contains("Cramér's V", text);
        Assert.Contains("Webber, Moffat & Zobel 2010", text);
        Assert.Contains("The cohort check below flags markers", text);
        Assert.DoesNotContain("were not checked", text);
    }

    [Fact]
    public void The_flags_table_names_the_planted_cohort_artefact_and_the_cohort_it_separates()
    {
        var result = Screened.Value.Result;
        // The planted artefact is flagged by the cohort check itself; the report must carry that flag.
        Assert.Equal(CohortFlag.CohortArtefact, result.Cohorts!.Marker(Artefact)!.Flag);
        var document = Markup.Parse(Report.Value);
        bool shortlisted = result.Shortlist.Any(e => e.Forest.FeatureIndex == Artefact);

        var table = TableStartingWith(document, shortlisted ? CohortReportTables.ShortlistFlagsCaption : CohortReportTables.OutsideArtefactsCaption);
        Assert.NotNull(table);
        var row = BodyCells(table!).Single(cells => cells[1] == ArtefactName);
        Assert.Contains(Hostile, row);
        if (shortlisted) Assert.Contains("cohort artefact", row);
        // The consistent marker is never listed among the artefacts.
        Assert.DoesNotContain(BodyCells(table!), cells => cells[1] == ConsistentName && cells.Contains("cohort artefact"));
    }

    [Fact]
    public void Every_top_marker_gets_a_forest_plot_with_title_axis_labels_and_null_line_caption()
    {
        var result = Screened.Value.Result;
        Assert.NotEmpty(result.Shortlist);
        var document = Markup.Parse(Report.Value);
        var forests = Markup.Elements(document, "svg")
            .Where(svg => svg.Elements().First(e => e.Name.LocalName == "title").Value.StartsWith("AUC of ", StringComparison.Ordinal)).ToList();

        Assert.Equal(Math.Min(CohortReportCharts.ForestPlotMarkerLimit, result.Shortlist.Count), forests.Count);
        for (int i = 0; i < forests.Count; i++)
        {
            string title = forests[i].Elements().First(e => e.Name.LocalName == "title").Value;
            Assert.Equal("AUC of " + result.Shortlist[i].Forest.Feature + " in each cohort", title);
            var texts = Markup.Texts(new XDocument(forests[i]), "text");
            Assert.Contains(title, texts);
            Assert.Contains(CohortReportCharts.AucAxisLabel, texts);
            Assert.Contains(CohortReportCharts.CohortAxisLabel, texts);
            Assert.Contains(CohortReportCharts.PooledLabel, texts);
            foreach (var name in CohortNames) Assert.Contains(name, texts);
            var caption = forests[i].Parent!.Elements().Single(e => e.Name.LocalName == "figcaption").Value;
            Assert.Contains("I² = ", caption);
            Assert.Contains("tau² = ", caption);
        }
    }

    [Fact]
    public void Concordance_lists_every_pair_of_screened_cohorts_and_maps_them_from_three()
    {
        var cohorts = Screened.Value.Result.Cohorts!;
        Assert.Equal(3, cohorts.ScreenedCohorts.Count);
        var document = Markup.Parse(Report.Value);

        var rows = BodyCells(TableStartingWith(document, CohortReportTables.ConcordanceCaption)!);
        Assert.Equal(3, rows.Count);
        Assert.Contains(rows, r => r[0] == Formula && r[1] == Hostile);
        var map = Markup.Elements(document, "svg").Single(svg => svg.Elements().First(e => e.Name.LocalName == "title").Value == CohortReportCharts.ConcordanceTitle);
        var mapTexts = Markup.Texts(new XDocument(map), "text");
        Assert.Contains(CohortReportCharts.ConcordanceTitle, mapTexts);
        Assert.Contains(CohortReportCharts.ConcordanceColourLabel, mapTexts);
    }

    [Fact]
    public void Leave_one_cohort_out_table_has_a_row_per_held_out_cohort_and_a_comparison_sentence()
    {
        var result = Screened.Value.Result;
        var document = Markup.Parse(Report.Value);

        var rows = BodyCells(TableStartingWith(document, CohortReportTables.HeldOutCaption)!);
        Assert.Equal(result.Cohorts!.HeldOut.Count, rows.Count);
        Assert.Equal(result.Cohorts.HeldOut.Select(h => h.Cohort), rows.Select(r => r[0]));
        Assert.NotNull(result.PanelSize);
        Assert.Contains("selection-aware cross-validated", Report.Value);
    }

    [Fact]
    public void Hostile_cohort_names_are_escaped_and_no_sample_id_appears()
    {
        string html = Report.Value;
        var document = Markup.Parse(html);

        Assert.Empty(Markup.Elements(document, "b"));
        Assert.DoesNotContain(Hostile, html, StringComparison.Ordinal);
        Assert.Contains("&lt;b&gt;north&lt;/b&gt;", html, StringComparison.Ordinal);
        var texts = document.Descendants().Select(e => string.Concat(e.Nodes().OfType<XText>().Select(t => t.Value))).ToList();
        Assert.Contains(texts, t => t == Formula);
        Assert.DoesNotContain("SAMPLE-ID-", html, StringComparison.Ordinal);
    }

    [Fact]
    public void The_cohort_section_renders_byte_identical_html_twice()
    {
        Assert.Equal(Report.Value, ScreenReport.Render(Input(Screened.Value.Result)));
    }

    [Fact]
    public void A_confounded_design_gets_a_warning_box_that_outcome_and_cohort_cannot_be_separated()
    {
        var result = Screened.Value.Result;
        Assert.False(result.Cohorts!.Confounded);
        Assert.DoesNotContain(CohortReportSection.ConfoundedHeading, Report.Value);

        string html = ScreenReport.Render(Input(result with { Cohorts = result.Cohorts with { Confounded = true } }));

        var warning = Markup.Elements(Markup.Parse(html), "aside").Single(a => a.Elements().First().Value == CohortReportSection.ConfoundedHeading);
        Assert.Contains("no method can tell", warning.Value);
    }

    [Fact]
    public void A_screen_without_cohorts_has_no_cohorts_section_and_says_cohort_artefacts_were_not_checked()
    {
        string html = ScreenReport.Render(Input(Screened.Value.Result with { Cohorts = null }));
        var document = Markup.Parse(html);

        Assert.DoesNotContain(CohortReportSection.Heading, Headings(document));
        Assert.Contains(ScreenReportText.NoCohortCaution, Markup.Texts(document, "p"));
        Assert.Contains("--cohort", html);
        Assert.Null(TableStartingWith(document, CohortReportTables.HeldOutCaption));
        Assert.DoesNotContain(Markup.Elements(document, "svg"),
            svg => svg.Elements().First(e => e.Name.LocalName == "title").Value.StartsWith("AUC of ", StringComparison.Ordinal));
    }

    private static HeldOutCohort Held(string cohort, double auc, double low, double high) =>
        new(cohort, 50, 5, auc, new ConfidenceInterval(low, high, 0.95), 0.2);

    private static PanelSizeCurve Curve(double selectionAwareAuc) =>
        new("auc", [new PanelSizePoint(5, selectionAwareAuc, 0.02, 0.01, 0.15, selectionAwareAuc + 0.02, 0.02, 0.1, 5)], 5, 5, 1);

    [Fact]
    public void Held_out_comparison_names_only_cohorts_whose_interval_lies_below_the_selection_aware_estimate()
    {
        // Hand-built: selection-aware AUC 0.90; "far" has interval [0.70, 0.85] wholly below it, "near" [0.80, 0.95] spans it.
        string sentence = CohortReportSection.HeldOutComparison(Curve(0.90), [Held("near", 0.88, 0.80, 0.95), Held("far", 0.78, 0.70, 0.85)]);

        Assert.Contains("from 0.780 to 0.880", sentence);
        Assert.Contains("0.900 at the recommended 5 markers", sentence);
        Assert.Contains("interval of far lies below it", sentence);
        Assert.DoesNotContain("near", sentence);

        string none = CohortReportSection.HeldOutComparison(Curve(0.90), [Held("near", 0.88, 0.80, 0.95)]);
        Assert.Contains("no held-out cohort's 95% interval lies below", none);
        Assert.Contains("not computed", CohortReportSection.HeldOutComparison(null, [Held("near", 0.88, 0.80, 0.95)]));
    }

    [Fact]
    public void P_values_below_one_in_a_thousand_are_written_as_an_upper_bound()
    {
        Assert.Equal("p < 0.001", CohortReportSection.PValue(6.4e-5));
        Assert.Equal("p = 0.057", CohortReportSection.PValue(0.0571));
        Assert.Equal("p = n/a", CohortReportSection.PValue(double.NaN));
    }
}
