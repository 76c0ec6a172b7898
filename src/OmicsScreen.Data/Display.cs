using System.Globalization;
using System.Text;

namespace OmicsScreen.Data;

/// <summary>Renders names and cell text safely inside error messages.</summary>
internal static class Display
{
    private const int MaxShown = 60;

    /// <summary>A name or cell as an error message shows it: <see cref="UntrustedText.Printable"/>, cut at 60 characters.</summary>
    public static string Name(ReadOnlySpan<char> text) => UntrustedText.Printable(text, MaxShown);

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
