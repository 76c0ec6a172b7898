namespace OmicsScreen.Reporting.Charts;

/// <summary>Text measures and shortening for chart labels, without a font engine.</summary>
internal static class ChartText
{
    /// <summary>
    /// Average advance of a sans-serif glyph as a share of the font size. An estimate (common
    /// practice for layout without font metrics); margins are sized from it with some slack.
    /// </summary>
    public const double AverageGlyphWidth = 0.6;

    public static double EstimateWidth(string text, double fontSize = SvgWriter.FontSize) =>
        text.Length * fontSize * AverageGlyphWidth;

    /// <summary>The text cut to <paramref name="maxCharacters"/> with an ellipsis, never splitting a surrogate pair.</summary>
    public static string Shorten(string text, int maxCharacters)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(maxCharacters, 2);
        if (text.Length <= maxCharacters) return text;
        int cut = maxCharacters - 1;
        if (char.IsHighSurrogate(text[cut - 1])) cut--;
        return string.Concat(text.AsSpan(0, cut), "\u2026");
    }

    /// <summary>Width of the widest label, estimated.</summary>
    public static double WidestLabel(IReadOnlyList<AxisTick> ticks)
    {
        double widest = 0;
        foreach (var tick in ticks) widest = Math.Max(widest, EstimateWidth(tick.Label));
        return widest;
    }
}
