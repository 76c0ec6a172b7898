using System.Text;
using OmicsScreen.Reporting.Charts;

namespace OmicsScreen.Reporting.Html;

/// <summary>
/// Builds one self-contained report page: every text passes through <see cref="MarkupText"/>,
/// there is no method taking raw markup, and the only embedded markup is an <see cref="SvgImage"/>
/// made by this project's charts. The output is XHTML-compatible HTML5 (well-formed XML), has one
/// inline style sheet, no script element, and a Content-Security-Policy that forbids every network
/// request, so the page can be opened from a results folder on a machine without network.
/// </summary>
/// <remarks>
/// Call order: <see cref="BeginDocument"/>, content, nested <see cref="BeginSection"/> /
/// <see cref="EndSection"/>, then <see cref="EndDocument"/>, which returns the page and throws if a
/// section is left open. Sections set heading levels: the document title is h1, a top section h2.
/// </remarks>
public sealed class HtmlBuilder
{
    /// <summary>No source may be fetched; inline style only. There is no script to allow.</summary>
    public const string ContentSecurityPolicy = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

    private const int DeepestHeadingLevel = 6;

    private readonly StringBuilder _html = new(64 * 1024);
    private readonly List<(string Id, string Heading)> _topSections = [];
    private int _contentsAt = -1;
    private int _sectionDepth;
    private bool _begun;
    private bool _ended;

    /// <summary>Writes the document head and opens the body; <paramref name="title"/> becomes the page title and h1.</summary>
    public HtmlBuilder BeginDocument(string title, string language = "en")
    {
        if (_begun) throw new InvalidOperationException("The document has already begun.");
        ArgumentNullException.ThrowIfNull(title);
        _begun = true;
        _html.Append("<!DOCTYPE html>\n<html xmlns=\"http://www.w3.org/1999/xhtml\" lang=\"");
        MarkupText.AppendEncoded(_html, language);
        _html.Append("\">\n<head>\n<meta charset=\"utf-8\"/>\n");
        _html.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"");
        MarkupText.AppendEncoded(_html, ContentSecurityPolicy);
        _html.Append("\"/>\n<meta name=\"referrer\" content=\"no-referrer\"/>\n");
        _html.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n<title>");
        MarkupText.AppendEncoded(_html, title);
        _html.Append("</title>\n<style>\n").Append(ReportStyleSheet.Css).Append("\n</style>\n</head>\n<body>\n<main>\n<h1>");
        MarkupText.AppendEncoded(_html, title);
        _html.Append("</h1>\n");
        return this;
    }

    /// <summary>Opens a section with a heading one level below the enclosing one.</summary>
    public HtmlBuilder BeginSection(string heading)
    {
        EnsureOpen();
        int level = Math.Min(_sectionDepth + 2, DeepestHeadingLevel);
        _sectionDepth++;
        if (level == 2)
        {
            // Ids are numbered, never made from the heading, so a name from the data cannot shape an attribute.
            string id = "section-" + (_topSections.Count + 1).ToString(System.Globalization.CultureInfo.InvariantCulture);
            _topSections.Add((id, heading));
            _html.Append("<section id=\"").Append(id).Append("\">\n");
        }
        else _html.Append("<section>\n");
        AppendHeading(level, heading);
        return this;
    }

    public HtmlBuilder EndSection()
    {
        EnsureOpen();
        if (_sectionDepth == 0) throw new InvalidOperationException("No section is open.");
        _sectionDepth--;
        _html.Append("</section>\n");
        return this;
    }

    public HtmlBuilder Paragraph(string text)
    {
        EnsureOpen();
        AppendElement("p", text);
        return this;
    }

    /// <summary>A small-print paragraph under a table that spells out its column headers.</summary>
    public HtmlBuilder Legend(string text)
    {
        EnsureOpen();
        _html.Append("<p class=\"legend\">");
        MarkupText.AppendEncoded(_html, text);
        _html.Append("</p>\n");
        return this;
    }

    public HtmlBuilder BulletList(IEnumerable<string> items)
    {
        EnsureOpen();
        ArgumentNullException.ThrowIfNull(items);
        _html.Append("<ul>\n");
        foreach (var item in items) AppendElement("li", item);
        _html.Append("</ul>\n");
        return this;
    }

    /// <summary>A term/description list, for run settings and manifest values.</summary>
    public HtmlBuilder DefinitionList(IEnumerable<KeyValuePair<string, string>> entries)
    {
        EnsureOpen();
        ArgumentNullException.ThrowIfNull(entries);
        _html.Append("<dl>\n");
        foreach (var entry in entries)
        {
            AppendElement("dt", entry.Key);
            AppendElement("dd", entry.Value);
        }
        _html.Append("</dl>\n");
        return this;
    }

    /// <summary>A highlighted box for research-use cautions and warnings about the data.</summary>
    public HtmlBuilder Caution(string heading, IEnumerable<string> paragraphs)
    {
        EnsureOpen();
        ArgumentNullException.ThrowIfNull(paragraphs);
        _html.Append("<aside class=\"caution\" role=\"note\">\n");
        AppendHeading(Math.Min(_sectionDepth + 2, DeepestHeadingLevel), heading);
        foreach (var paragraph in paragraphs) AppendElement("p", paragraph);
        _html.Append("</aside>\n");
        return this;
    }

    public HtmlBuilder Table(HtmlTable table)
    {
        EnsureOpen();
        ArgumentNullException.ThrowIfNull(table);
        var columns = table.Columns;
        _html.Append("<table>\n<caption>");
        MarkupText.AppendEncoded(_html, table.Caption);
        _html.Append("</caption>\n<thead>\n<tr>");
        foreach (var column in columns)
        {
            _html.Append(column.Alignment == ColumnAlignment.Numeric ? "<th scope=\"col\" class=\"num\">" : "<th scope=\"col\">");
            MarkupText.AppendEncoded(_html, column.Header);
            _html.Append("</th>");
        }
        _html.Append("</tr>\n</thead>\n<tbody>\n");
        foreach (var row in table.Rows)
        {
            _html.Append("<tr>");
            for (int c = 0; c < row.Count; c++)
            {
                bool rowHeader = c == 0 && table.FirstColumnIsRowHeader;
                string tag = rowHeader ? "th" : "td";
                _html.Append('<').Append(tag);
                if (rowHeader) _html.Append(" scope=\"row\"");
                if (columns[c].Alignment == ColumnAlignment.Numeric) _html.Append(" class=\"num\"");
                else if (columns[c].Alignment == ColumnAlignment.Unbroken) _html.Append(" class=\"unbroken\"");
                _html.Append('>');
                MarkupText.AppendEncoded(_html, row[c]);
                _html.Append("</").Append(tag).Append('>');
            }
            _html.Append("</tr>\n");
        }
        _html.Append("</tbody>\n</table>\n");
        return this;
    }

    /// <summary>Embeds a chart with a caption under it.</summary>
    public HtmlBuilder Figure(SvgImage image, string caption)
    {
        EnsureOpen();
        ArgumentNullException.ThrowIfNull(image);
        _html.Append("<figure>\n").Append(image.Markup).Append('\n');
        AppendElement("figcaption", caption);
        _html.Append("</figure>\n");
        return this;
    }

    /// <summary>
    /// Marks where the table of contents goes: a list of links to every top-level section, filled
    /// in by <see cref="EndDocument"/> once all sections are known.
    /// </summary>
    public HtmlBuilder TableOfContents()
    {
        EnsureOpen();
        if (_contentsAt >= 0) throw new InvalidOperationException("The document already has a table of contents.");
        _contentsAt = _html.Length;
        return this;
    }

    /// <summary>Closes the body and returns the page.</summary>
    public string EndDocument()
    {
        EnsureOpen();
        if (_sectionDepth != 0) throw new InvalidOperationException($"{_sectionDepth} section(s) are still open.");
        _ended = true;
        _html.Append("</main>\n</body>\n</html>\n");
        if (_contentsAt >= 0 && _topSections.Count > 0)
        {
            var contents = new StringBuilder("<nav class=\"contents\" aria-label=\"Contents\">\n<p class=\"contents-title\">Contents</p>\n<ol>\n");
            foreach (var (id, heading) in _topSections)
            {
                contents.Append("<li><a href=\"#").Append(id).Append("\">");
                MarkupText.AppendEncoded(contents, heading);
                contents.Append("</a></li>\n");
            }
            contents.Append("</ol>\n</nav>\n");
            _html.Insert(_contentsAt, contents.ToString());
        }
        return _html.ToString();
    }

    private void AppendHeading(int level, string text)
    {
        char digit = (char)('0' + level);
        _html.Append("<h").Append(digit).Append('>');
        MarkupText.AppendEncoded(_html, text);
        _html.Append("</h").Append(digit).Append(">\n");
    }

    private void AppendElement(string tag, string? text)
    {
        _html.Append('<').Append(tag).Append('>');
        MarkupText.AppendEncoded(_html, text);
        _html.Append("</").Append(tag).Append(">\n");
    }

    private void EnsureOpen()
    {
        if (!_begun) throw new InvalidOperationException("Call BeginDocument first.");
        if (_ended) throw new InvalidOperationException("The document has already ended.");
    }
}
