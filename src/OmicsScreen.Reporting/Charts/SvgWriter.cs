using System.Globalization;
using System.Text;
using OmicsScreen.Reporting.Html;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// Writes SVG markup for the charts. Every text and attribute value goes through
/// <see cref="MarkupText"/>; coordinates are written in invariant culture rounded to two decimals
/// (a hundredth of a pixel is below anything visible, and fixed rounding makes the same input give
/// byte-identical output on every machine).
/// </summary>
/// <remarks>
/// No element carries an id: several charts sit in one report page, and ids would have to be
/// unique across it. Accessibility uses aria-label and the title/desc children instead.
/// </remarks>
internal sealed class SvgWriter
{
    public const string FontFamily = "system-ui, -apple-system, 'Segoe UI', Roboto, 'DejaVu Sans', Arial, sans-serif";
    public const string TextColour = "#1b1b1b";
    public const double FontSize = 12;

    private readonly StringBuilder _svg = new(16 * 1024);
    private readonly string _title;
    private readonly int _width;
    private readonly int _height;
    private int _openGroups;

    public SvgWriter(int width, int height, string title, string description)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(width, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(height, 1);
        _title = title ?? string.Empty;
        _width = width;
        _height = height;
        _svg.Append("<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"").Append(width.ToString(CultureInfo.InvariantCulture))
            .Append("\" height=\"").Append(height.ToString(CultureInfo.InvariantCulture))
            .Append("\" viewBox=\"0 0 ").Append(width.ToString(CultureInfo.InvariantCulture)).Append(' ')
            .Append(height.ToString(CultureInfo.InvariantCulture)).Append("\" role=\"img\" aria-label=\"");
        MarkupText.AppendEncoded(_svg, _title);
        _svg.Append("\" font-family=\"");
        MarkupText.AppendEncoded(_svg, FontFamily);
        _svg.Append("\" font-size=\"12\">\n<title>");
        MarkupText.AppendEncoded(_svg, _title);
        _svg.Append("</title>\n<desc>");
        MarkupText.AppendEncoded(_svg, description);
        _svg.Append("</desc>\n");
        Rect(0, 0, width, height, "#ffffff");
    }

    public void Line(double x1, double y1, double x2, double y2, string stroke, double strokeWidth = 1, string? dash = null)
    {
        _svg.Append("<line x1=\"");
        Number(x1).Append("\" y1=\"");
        Number(y1).Append("\" x2=\"");
        Number(x2).Append("\" y2=\"");
        Number(y2).Append('"');
        Stroke(stroke, strokeWidth, dash);
        _svg.Append("/>\n");
    }

    public void Rect(double x, double y, double width, double height, string fill, string? stroke = null,
        double strokeWidth = 1, double opacity = 1)
    {
        _svg.Append("<rect x=\"");
        Number(x).Append("\" y=\"");
        Number(y).Append("\" width=\"");
        Number(Math.Max(0, width)).Append("\" height=\"");
        Number(Math.Max(0, height)).Append("\" fill=\"");
        MarkupText.AppendEncoded(_svg, fill);
        _svg.Append('"');
        if (opacity < 1) Attribute("fill-opacity", opacity);
        if (stroke is not null) Stroke(stroke, strokeWidth, null);
        _svg.Append("/>\n");
    }

    /// <summary>
    /// A dot; <paramref name="fill"/> "none" gives a hollow marker. <paramref name="tooltip"/> adds a
    /// title child, shown on hover and read by screen readers.
    /// </summary>
    public void Circle(double centreX, double centreY, double radius, string fill, string? stroke = null, double strokeWidth = 1,
        double opacity = 1, string? tooltip = null)
    {
        _svg.Append("<circle cx=\"");
        Number(centreX).Append("\" cy=\"");
        Number(centreY).Append("\" r=\"");
        Number(radius).Append("\" fill=\"");
        MarkupText.AppendEncoded(_svg, fill);
        _svg.Append('"');
        if (opacity < 1) Attribute("fill-opacity", opacity);
        if (stroke is not null) Stroke(stroke, strokeWidth, null);
        if (tooltip is null)
        {
            _svg.Append("/>\n");
            return;
        }
        _svg.Append("><title>");
        MarkupText.AppendEncoded(_svg, tooltip);
        _svg.Append("</title></circle>\n");
    }

    /// <summary>An open line through the points (a polyline).</summary>
    public void Polyline(ReadOnlySpan<double> xs, ReadOnlySpan<double> ys, string stroke, double strokeWidth = 1.5, string? dash = null)
    {
        if (xs.Length != ys.Length) throw new ArgumentException("x and y counts differ.");
        if (xs.Length < 2) return;
        _svg.Append("<polyline points=\"");
        Points(xs, ys);
        _svg.Append("\" fill=\"none\"");
        Stroke(stroke, strokeWidth, dash);
        _svg.Append(" stroke-linejoin=\"round\"/>\n");
    }

    /// <summary>A closed filled shape (shaded bands, diamonds).</summary>
    public void Polygon(ReadOnlySpan<double> xs, ReadOnlySpan<double> ys, string fill, double opacity = 1, string? stroke = null)
    {
        if (xs.Length != ys.Length) throw new ArgumentException("x and y counts differ.");
        if (xs.Length < 3) return;
        _svg.Append("<polygon points=\"");
        Points(xs, ys);
        _svg.Append("\" fill=\"");
        MarkupText.AppendEncoded(_svg, fill);
        _svg.Append('"');
        if (opacity < 1) Attribute("fill-opacity", opacity);
        if (stroke is not null) Stroke(stroke, 1, null);
        _svg.Append("/>\n");
    }

    /// <summary>
    /// Text at (x, y) on its baseline. <paramref name="tooltip"/> adds a title child, used when a
    /// long name was shortened so the full name is still available on hover and to screen readers.
    /// </summary>
    public void Text(double x, double y, string text, TextAnchor anchor = TextAnchor.Start, double size = FontSize,
        bool bold = false, double rotateDegrees = 0, string fill = TextColour, string? tooltip = null)
    {
        _svg.Append("<text x=\"");
        Number(x).Append("\" y=\"");
        Number(y).Append('"');
        if (anchor != TextAnchor.Start) _svg.Append(" text-anchor=\"").Append(anchor == TextAnchor.Middle ? "middle" : "end").Append('"');
        if (size != FontSize) Attribute("font-size", size);
        if (bold) _svg.Append(" font-weight=\"bold\"");
        if (fill != TextColour)
        {
            _svg.Append(" fill=\"");
            MarkupText.AppendEncoded(_svg, fill);
            _svg.Append('"');
        }
        if (rotateDegrees != 0)
        {
            _svg.Append(" transform=\"rotate(");
            Number(rotateDegrees).Append(' ');
            Number(x).Append(' ');
            Number(y).Append(")\"");
        }
        _svg.Append('>');
        if (tooltip is not null && tooltip != text)
        {
            _svg.Append("<title>");
            MarkupText.AppendEncoded(_svg, tooltip);
            _svg.Append("</title>");
        }
        MarkupText.AppendEncoded(_svg, text);
        _svg.Append("</text>\n");
    }

    /// <summary>Opens a group; <paramref name="label"/> names it for assistive technology.</summary>
    public void BeginGroup(string? label = null)
    {
        _openGroups++;
        if (label is null)
        {
            _svg.Append("<g>\n");
            return;
        }
        _svg.Append("<g aria-label=\"");
        MarkupText.AppendEncoded(_svg, label);
        _svg.Append("\">\n");
    }

    public void EndGroup()
    {
        if (_openGroups == 0) throw new InvalidOperationException("No group is open.");
        _openGroups--;
        _svg.Append("</g>\n");
    }

    public SvgImage Finish()
    {
        if (_openGroups != 0) throw new InvalidOperationException("A group is still open.");
        _svg.Append("</svg>");
        return new SvgImage(_svg.ToString(), _title, _width, _height);
    }

    private void Stroke(string stroke, double strokeWidth, string? dash)
    {
        _svg.Append(" stroke=\"");
        MarkupText.AppendEncoded(_svg, stroke);
        _svg.Append('"');
        if (strokeWidth != 1) Attribute("stroke-width", strokeWidth);
        if (dash is not null)
        {
            _svg.Append(" stroke-dasharray=\"");
            MarkupText.AppendEncoded(_svg, dash);
            _svg.Append('"');
        }
    }

    private void Attribute(string name, double value)
    {
        _svg.Append(' ').Append(name).Append("=\"");
        Number(value).Append('"');
    }

    private void Points(ReadOnlySpan<double> xs, ReadOnlySpan<double> ys)
    {
        for (int i = 0; i < xs.Length; i++)
        {
            if (i > 0) _svg.Append(' ');
            Number(xs[i]).Append(',');
            Number(ys[i]);
        }
    }

    private StringBuilder Number(double value) => _svg.Append(ChartNumber.Coordinate(value));
}
