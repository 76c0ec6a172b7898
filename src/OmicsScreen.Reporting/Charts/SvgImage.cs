namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// A finished chart: standalone SVG markup (with the SVG namespace, so it parses as XML on its own
/// and inlines into the report). Only this project's charts can make one, which keeps raw markup out
/// of <see cref="Html.HtmlBuilder"/>'s reach for user data.
/// </summary>
public sealed class SvgImage
{
    internal SvgImage(string markup, string title, int width, int height)
    {
        Markup = markup;
        Title = title;
        Width = width;
        Height = height;
    }

    public string Markup { get; }

    /// <summary>The chart's title, also its accessible name.</summary>
    public string Title { get; }

    public int Width { get; }

    public int Height { get; }

    public override string ToString() => Markup;
}
