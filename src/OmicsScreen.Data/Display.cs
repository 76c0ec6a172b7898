using System.Globalization;
using System.Text;

namespace OmicsScreen.Data;

/// <summary>Renders names and cell text safely inside error messages.</summary>
internal static class Display
{
    private const int MaxShown = 60;

    /// <summary>The text with control characters made visible (\n, \t, \u0001) and long text cut.</summary>
    public static string Name(ReadOnlySpan<char> text)
    {
        var builder = new StringBuilder(Math.Min(text.Length, MaxShown) + 8);
        foreach (char c in text)
        {
            if (builder.Length >= MaxShown) { builder.Append('…'); break; }
            switch (c)
            {
                case '\n': builder.Append("\\n"); break;
                case '\r': builder.Append("\\r"); break;
                case '\t': builder.Append("\\t"); break;
                default:
                    if (char.IsControl(c)) builder.Append("\\u").Append(((int)c).ToString("x4", CultureInfo.InvariantCulture));
                    // Bidirectional overrides and zero-width characters would reorder or hide what is shown.
                    else if (char.GetUnicodeCategory(c) == UnicodeCategory.Format) builder.Append("<U+").Append(((int)c).ToString("X4", CultureInfo.InvariantCulture)).Append('>');
                    else builder.Append(c);
                    break;
            }
        }
        return builder.ToString();
    }

    /// <summary>The text with each line break (and the spaces around it) replaced by one space.</summary>
    public static string OneLine(string text)
    {
        if (text.AsSpan().IndexOfAny('\r', '\n') < 0) return text;
        var builder = new StringBuilder(text.Length);
        foreach (var line in text.AsSpan().EnumerateLines())
        {
            var trimmed = line.Trim();
            if (trimmed.IsEmpty) continue;
            if (builder.Length > 0) builder.Append(' ');
            builder.Append(trimmed);
        }
        return builder.ToString();
    }

    /// <summary>"'a', 'b', 'c' and 7 more" — the first few names, then a count.</summary>
    public static string List(IReadOnlyList<string> names, int shown = 5)
    {
        var builder = new StringBuilder();
        int count = Math.Min(shown, names.Count);
        for (int i = 0; i < count; i++)
        {
            if (i > 0) builder.Append(", ");
            builder.Append('\'').Append(Name(names[i])).Append('\'');
        }
        if (names.Count > count)
            builder.Append(CultureInfo.InvariantCulture, $" and {names.Count - count} more");
        return builder.ToString();
    }
}
