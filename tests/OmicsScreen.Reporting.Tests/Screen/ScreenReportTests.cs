using System.Text.Json;
using System.Xml.Linq;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Tests.Support;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>The screen report rendered from a real (small) screen with hostile names.</summary>
public sealed class ScreenReportTests
{
    private static readonly Lazy<string> DefaultReport = new(() => ScreenReport.Render(ScreenReportSample.Input()));

    private static XElement TableByCaption(XDocument document, string caption) =>
        Markup.Elements(document, "table").Single(t => Markup.Elements(new XDocument(t), "caption").Single().Value == caption);

    private static List<XElement> BodyRows(XElement table) =>
        table.Descendants().Where(e => e.Name.LocalName == "tbody").Single().Elements().Where(e => e.Name.LocalName == "tr").ToList();

    [Fact]
    public void Report_is_well_formed_xml_without_any_script_element()
    {
        var document = Markup.Parse(DefaultReport.Value);

        Assert.Empty(Markup.Elements(document, "script"));
        Assert.DoesNotContain("<script", DefaultReport.Value, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;", DefaultReport.Value);
    }

    [Fact]
    public void Report_loads_nothing_from_outside_the_page()
    {
        var document = Markup.Parse(DefaultReport.Value);

        foreach (var attribute in document.Descendants().Attributes())
        {
            if (attribute.IsNamespaceDeclaration) continue;
            string name = attribute.Name.LocalName;
            // Links within the page (the table of contents) load nothing.
            if (name == "href" && attribute.Value.StartsWith('#')) continue;
            Assert.False(name is "src" or "href" or "srcset" or "action" or "data", $"{attribute.Parent!.Name.LocalName} has a {name} attribute.");
        }
        Assert.Empty(Markup.Elements(document, "link"));
        Assert.Empty(Markup.Elements(document, "iframe"));
    }

    [Fact]
    public void Hostile_feature_class_cohort_and_file_names_appear_as_plain_text()
    {
        var document = Markup.Parse(DefaultReport.Value);
        var texts = document.Descendants().Select(e => string.Concat(e.Nodes().OfType<XText>().Select(t => t.Value))).ToList();

        var shortlisted = ScreenReportSample.Result.Shortlist.Select(e => e.Forest.Feature).ToHashSet();
        var hostileShortlisted = ScreenReportSample.HostileNames.Where(shortlisted.Contains).ToList();
        Assert.NotEmpty(hostileShortlisted);
        var markerCells = BodyRows(TableByCaption(document, ScreenReportTables.ShortlistCaption))
            .Select(row => row.Elements().ElementAt(1).Value).ToList();
        foreach (var name in hostileShortlisted) Assert.Contains(name, markerCells);
        Assert.Contains(texts, t => t.Contains(ScreenReportSample.CaseClass, StringComparison.Ordinal));
        Assert.Contains(texts, t => t.Contains(ScreenReportSample.ControlClass, StringComparison.Ordinal));
        Assert.Contains(texts, t => t.Contains("north & <west>", StringComparison.Ordinal));
        Assert.Contains(texts, t => t == "data/<panel> & co.csv");
    }

    [Fact]
    public void The_locked_panel_lists_its_markers_in_screen_order_with_their_role()
    {
        var result = ScreenReportSample.Result;
        Assert.True(result.LockedPanelSize > 0);
        var rows = BodyRows(TableByCaption(Markup.Parse(DefaultReport.Value), ScreenReportTables.LockedPanelCaption));

        Assert.Equal(result.LockedPanelSize, rows.Count);
        for (int i = 0; i < rows.Count; i++)
        {
            var cells = rows[i].Elements().Select(c => c.Value).ToList();
            Assert.Equal(result.Features[result.Order[i]].Feature, cells[1]);
            Assert.False(string.IsNullOrWhiteSpace(cells[2]));
        }
    }

    [Fact]
    public void The_report_opens_with_a_table_of_contents_linking_every_top_section()
    {
        var document = Markup.Parse(DefaultReport.Value);
        var links = Markup.Elements(document, "nav").Single().Descendants().Where(e => e.Name.LocalName == "a").ToList();
        var sections = Markup.Elements(document, "section").Where(e => e.Attribute("id") is not null).ToList();
        Assert.Equal(sections.Count, links.Count);
        Assert.True(links.Count >= 5);
        for (int i = 0; i < links.Count; i++)
        {
            Assert.Equal("#" + sections[i].Attribute("id")!.Value, links[i].Attribute("href")!.Value);
            Assert.Equal(sections[i].Elements().First().Value, links[i].Value);
        }
    }

    [Fact]
    public void Shortlist_table_has_one_row_per_shortlisted_marker_in_shortlist_order()
    {
        var result = ScreenReportSample.Result;
        Assert.NotEmpty(result.Shortlist);
        var rows = BodyRows(TableByCaption(Markup.Parse(DefaultReport.Value), ScreenReportTables.ShortlistCaption));

        Assert.Equal(result.Shortlist.Count, rows.Count);
        for (int i = 0; i < rows.Count; i++)
        {
            var cells = rows[i].Elements().Select(c => c.Value).ToList();
            Assert.Equal(8, cells.Count);
            Assert.Equal((i + 1).ToString(System.Globalization.CultureInfo.InvariantCulture), cells[0]);
            Assert.Equal(result.Shortlist[i].Forest.Feature, cells[1]);
        }
    }

    [Fact]
    public void Every_chart_has_a_title_and_its_axis_labels()
    {
        var document = Markup.Parse(DefaultReport.Value);
        var charts = Markup.Elements(document, "svg").ToList();
        var result = ScreenReportSample.Result;
        int strips = Math.Min(ScreenReportCharts.StripMarkerLimit, result.Shortlist.Count);
        // importance x2, frequency, out-of-bag error, panel-size curve, one per top marker, correlation map,
        // then the cohort section: one forest plot per top marker and, from three screened cohorts, the agreement map
        int forests = result.Cohorts is null ? 0 : Math.Min(CohortReportCharts.ForestPlotMarkerLimit, result.Shortlist.Count);
        int cohortMap = result.Cohorts is { ScreenedCohorts.Count: >= CohortReportCharts.HeatMapMinimumCohorts } ? 1 : 0;
        // and how each marker acts (issue 19): a curve per shortlisted marker up to the limit, a heat map per strongest named pair
        int effects = Math.Min(EffectReportSection.ChartLimit, result.Effects.Markers.Count(m => m.Curve.GridCount >= 2)) + result.Effects.Surfaces.Count;
        int expected = 5 + strips + (result.Shortlist.Count >= 2 ? 1 : 0) + forests + cohortMap + StatisticianCharts(result) + effects;
        Assert.Equal(expected, charts.Count);

        foreach (var chart in charts)
        {
            var title = chart.Elements().First(e => e.Name.LocalName == "title").Value;
            Assert.False(string.IsNullOrWhiteSpace(title));
            var texts = Markup.Texts(new XDocument(chart), "text");
            Assert.Contains(title, texts);
        }
        var allTexts = Markup.Texts(document, "text");
        foreach (var label in new[]
                 {
                     ScreenReportCharts.CorrectedAxisLabel, ScreenReportCharts.PermutationAxisLabel, ScreenReportCharts.FeatureAxisLabel,
                     ScreenReportCharts.OrderAxisLabel, ScreenReportCharts.FrequencyAxisLabel, ScreenReportCharts.TreesAxisLabel,
                     ScreenReportCharts.ErrorAxisLabel, ScreenReportCharts.PanelSizeAxisLabel, ScreenReportCharts.PanelSizeScoreLabel(result.PanelSize!),
                     ScreenReportCharts.ClassAxisLabel, "Spearman correlation (rho)",
                 })
            Assert.Contains(label, allTexts);
    }

    [Fact]
    public void No_sample_id_appears_unless_asked_and_then_only_inside_chart_descriptions_and_point_titles()
    {
        foreach (var id in ScreenReportSample.SampleIds) Assert.DoesNotContain(id, DefaultReport.Value, StringComparison.Ordinal);
        Assert.DoesNotContain(ScreenReportSample.SampleIdPrefix, DefaultReport.Value, StringComparison.Ordinal);

        string shown = ScreenReport.Render(ScreenReportSample.Input(showSampleIds: true));
        Assert.Contains(ScreenReportSample.SampleIds[0], shown, StringComparison.Ordinal);
        var document = Markup.Parse(shown);
        foreach (var element in document.Descendants())
        {
            string ownText = string.Concat(element.Nodes().OfType<XText>().Select(t => t.Value));
            if (ownText.Contains(ScreenReportSample.SampleIdPrefix, StringComparison.Ordinal))
                Assert.True(element.Name.LocalName == "desc" || (element.Name.LocalName == "title" && element.Parent?.Name.LocalName == "circle"),
                    $"a sample id appears in <{element.Name.LocalName}>");
        }
        // Each point of a strip chart names its sample on hover: every sample of the panel once per chart.
        var pointTitles = document.Descendants().Where(e => e.Name.LocalName == "title" && e.Parent?.Name.LocalName == "circle")
            .Select(e => e.Value).ToList();
        Assert.Contains(pointTitles, title => title.StartsWith(ScreenReportSample.SampleIds[0] + ": ", StringComparison.Ordinal));
        Assert.DoesNotContain("</title></circle>", DefaultReport.Value, StringComparison.Ordinal);
    }

    [Fact]
    public void The_same_input_renders_byte_identical_html()
    {
        string again = ScreenReport.Render(ScreenReportSample.Input());

        Assert.Equal(DefaultReport.Value, again);
    }

    [Fact]
    public void A_comma_decimal_culture_changes_no_byte_of_the_report()
    {
        string underCommaCulture;
        using (CultureScope.CommaDecimal()) underCommaCulture = ScreenReport.Render(ScreenReportSample.Input());

        Assert.Equal(DefaultReport.Value, underCommaCulture);
    }

    [Fact]
    public void An_empty_shortlist_is_said_plainly_and_the_top_features_are_labelled_not_shortlisted()
    {
        var empty = ScreenReportSample.Result with { Shortlist = [], ShortlistCorrelations = new double[0, 0] };
        string html = ScreenReport.Render(ScreenReportSample.Input(result: empty));
        var document = Markup.Parse(html);

        Assert.Contains("No marker was shortlisted", html);
        Assert.DoesNotContain(Markup.Elements(document, "caption"), c => c.Value == ScreenReportTables.ShortlistCaption);
        var fallback = Markup.Elements(document, "table").Single(t => t.Elements().First().Value.StartsWith("NOT shortlisted", StringComparison.Ordinal));
        var rows = BodyRows(fallback);
        Assert.Equal(ScreenReportTables.FallbackFeatureCount, rows.Count);
        Assert.Equal(empty.Features[empty.Order[0]].Feature, rows[0].Elements().ElementAt(1).Value);
        // No strip charts or correlation map without markers; the screen-wide charts stay.
        Assert.Equal(5 + StatisticianCharts(empty), Markup.Elements(document, "svg").Count());
    }

    /// <summary>
    /// The sample maps (by class, and by cohort when there is one), screen order against AUC, the
    /// decoys when there are any, and the locked panel's cross-validated ROC curve when a panel is locked.
    /// </summary>
    private static int StatisticianCharts(ScreenResult result) =>
        2 + (ScreenReportSample.Panel.Cohort is null ? 0 : 1) + (result.Repeats.DecoyCount > 0 ? 1 : 0)
        + (Math.Min(result.LockedPanelSize, result.Shortlist.Count) > 0 && result.PanelSize is { LockedOutOfFoldScores.Count: > 0 } ? 1 : 0);

    [Fact]
    public void Every_screen_option_is_listed_under_its_label_and_option()
    {
        // A setting added to ScreenOptions later must join the vocabulary (ScreenParameters), or it would
        // be left out of the report and the manifest. The automatic decoy floor and ceiling are constants shown with --decoys,
        // the interaction scan's pair limit with --interaction-scan.
        var terms = Markup.Elements(Markup.Parse(DefaultReport.Value), "dt").Select(e => e.Value).ToHashSet();
        var covered = ScreenParameters.All.Select(p => p.Property).ToHashSet();
        foreach (var property in typeof(ScreenOptions).GetProperties())
            if (property.Name is not (nameof(ScreenOptions.AutomaticDecoyFloor) or nameof(ScreenOptions.AutomaticDecoyCeiling)
                or nameof(ScreenOptions.InteractionScanPairLimit)))
                Assert.Contains(property.Name, covered);
        foreach (var parameter in ScreenParameters.All)
            Assert.Contains(parameter.Label + " (" + parameter.Option + ")", terms);
    }

    [Fact]
    public void Report_states_the_cautions_and_points_to_the_manifest()
    {
        string html = DefaultReport.Value;

        Assert.Contains("Research use only", html);
        Assert.Contains("not a diagnostic test", html);
        Assert.Contains("independent cohorts", html);
        Assert.Contains("data-protection", html);
        Assert.Contains("tracks a batch", html);
        Assert.Contains(ScreenReportInput.ManifestFileName, html);
        Assert.Contains(new string('c', 64), html);
    }

    [Fact]
    public void Marker_values_split_by_class_keep_below_detection_apart_and_drop_missing_cells()
    {
        // Hand-built: 6 samples, classes a,a,a,b,b,b; sample 1 censored at limit 0.5, sample 4 missing.
        var states = new[] { CellState.Measured, CellState.BelowDetection, CellState.Measured, CellState.Measured, CellState.Missing, CellState.Measured };
        var matrix = new FeatureMatrix(["x"], ["s1", "s2", "s3", "s4", "s5", "s6"], [[1f, 0.5f, 3f, 4f, float.NaN, 6f]], [states]);
        var panel = new Panel(matrix, new ClassOutcome("y", ["a", "b"], [0, 0, 0, 1, 1, 1]));

        var values = MarkerValues.Of(panel, 0);

        Assert.Equal([1.0, 3.0], values.Groups[0].MeasuredValues);
        Assert.Equal(1, values.Groups[0].BelowDetectionCount);
        Assert.Equal([4.0, 6.0], values.Groups[1].MeasuredValues);
        Assert.Equal(0, values.Groups[1].BelowDetectionCount);
        Assert.Equal(0.5, values.DetectionLimit);
        Assert.True(values.AllMeasuredPositive);
    }

    [Fact]
    public void A_feature_with_a_non_positive_value_is_drawn_on_a_linear_axis()
    {
        var matrix = new FeatureMatrix(["x"], ["s1", "s2", "s3", "s4"], [[-1f, 2f, 3f, 4f]], [null]);
        var panel = new Panel(matrix, new ClassOutcome("y", ["a", "b"], [0, 0, 1, 1]));

        Assert.False(MarkerValues.Of(panel, 0).AllMeasuredPositive);
    }

    [Fact]
    public void Unmeasured_shares_count_missing_and_below_detection_cells_over_all_cells()
    {
        var states = new[] { CellState.Missing, CellState.BelowDetection, CellState.BelowDetection, CellState.Measured };
        var matrix = new FeatureMatrix(["x", "y"], ["s1", "s2", "s3", "s4"], [[float.NaN, 0.1f, 0.1f, 2f], [1f, 2f, 3f, 4f]], [states, null]);

        var (missing, belowDetection) = ScreenReport.UnmeasuredShares(matrix);

        Assert.Equal(1.0 / 8, missing);
        Assert.Equal(2.0 / 8, belowDetection);
    }
}
