using OmicsScreen.Reporting.Html;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Html;

public class HtmlBuilderTests
{
    [Fact]
    public void A_report_with_hostile_names_is_well_formed_and_shows_them_as_text()
    {
        string html = SampleReport.Build();
        var document = Markup.Parse(html); // throws when not well-formed
        string text = document.Root!.Value;
        foreach (var name in new[] { SampleReport.Script, SampleReport.Ampersand, SampleReport.Quotes, SampleReport.Formula, SampleReport.NonAscii })
            Assert.Contains(name, text);
        Assert.Empty(Markup.Elements(document, "script"));
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        // The table shows the names exactly as given, one per row.
        var rowHeaders = Markup.Elements(document, "tbody").Single().Elements().Select(row => row.Elements().First().Value).ToList();
        Assert.Equal(SampleReport.TableFeatureCells, rowHeaders);
    }

    [Fact]
    public void The_page_requests_nothing_from_the_network()
    {
        var document = Markup.Parse(SampleReport.Build());
        var attributes = document.Descendants().SelectMany(element => element.Attributes()).ToList();
        Assert.DoesNotContain(attributes, attribute => attribute.Name.LocalName is "src" or "href" or "srcset" or "action");
        Assert.DoesNotContain(attributes, attribute => attribute.Name.LocalName.StartsWith("on", StringComparison.OrdinalIgnoreCase));
        Assert.Empty(Markup.Elements(document, "link"));
        var policy = Markup.Elements(document, "meta").Single(meta => (string?)meta.Attribute("http-equiv") == "Content-Security-Policy");
        Assert.StartsWith("default-src 'none'", (string?)policy.Attribute("content"));
        Assert.Single(Markup.Elements(document, "style"));
    }

    [Fact]
    public void Print_styles_keep_figures_and_table_rows_whole()
    {
        string style = Markup.Elements(Markup.Parse(SampleReport.Build()), "style").Single().Value;
        Assert.Contains("@media print", style);
        Assert.Contains("figure, .caution, tr, dl { break-inside: avoid;", style);
        Assert.Contains("@page { size: A4", style);
    }

    [Fact]
    public void Sections_nest_headings_and_numeric_columns_align_right()
    {
        var table = new HtmlTable("T", [new HtmlTableColumn("name"), new HtmlTableColumn("value", ColumnAlignment.Numeric)]).AddRow("a", "1.5");
        string html = new HtmlBuilder().BeginDocument("Doc").BeginSection("Outer").BeginSection("Inner").Table(table)
            .EndSection().EndSection().EndDocument();
        var document = Markup.Parse(html);
        Assert.Equal("Doc", Markup.Elements(document, "h1").Single().Value);
        Assert.Equal("Outer", Markup.Elements(document, "h2").Single().Value);
        Assert.Equal("Inner", Markup.Elements(document, "h3").Single().Value);
        var cell = Markup.Elements(document, "td").Single();
        Assert.Equal(("1.5", "num"), (cell.Value, (string?)cell.Attribute("class")));
    }

    [Fact]
    public void Misuse_of_the_call_order_is_refused()
    {
        Assert.Throws<InvalidOperationException>(() => new HtmlBuilder().Paragraph("before the document"));
        Assert.Throws<InvalidOperationException>(() => new HtmlBuilder().BeginDocument("x").BeginSection("open").EndDocument());
        Assert.Throws<InvalidOperationException>(() => new HtmlBuilder().BeginDocument("x").EndSection());
        Assert.Throws<ArgumentException>(() => new HtmlTable("t", [new HtmlTableColumn("one")]).AddRow("a", "b"));
    }
}
