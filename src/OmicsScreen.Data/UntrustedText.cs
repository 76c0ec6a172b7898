using System.Globalization;
using System.Text;

namespace OmicsScreen.Data;

/// <summary>
/// Names and cell text from user files made safe to print on a console, in a log or in an error
/// message: the one rule every front end uses.
/// </summary>
/// <remarks>
/// Nothing that can act on a terminal or change how a line reads gets through: line breaks and tabs
/// become \n, \r and \t; every other control character (C0, DEL and C1, so ESC and CSI that start
/// terminal escape sequences, and the bell) becomes \uXXXX; format characters (bidirectional
/// overrides and isolates, zero-width spaces and joiners, the byte-order mark; Unicode category
/// Cf, as Unicode Technical Report 36 warns) and the line and paragraph separators become a visible
/// &lt;U+XXXX&gt;, as the HTML report shows them. Each character gets its own visible code rather than
/// one stand-in such as '?', so two names that differ only in a hidden character still print
/// differently and the user can search the file for the character named. The escapes are plain
/// ASCII, so printing already-escaped text again changes nothing.
/// </remarks>
public static class UntrustedText
{
    /// <summary>
    /// The printable form of <paramref name="text"/>, cut after <paramref name="maxLength"/>
    /// printed characters with '…' (no cut by default).
    /// </summary>
    public static string Printable(ReadOnlySpan<char> text, int maxLength = int.MaxValue)
    {
        if (text.Length <= maxLength && !NeedsEscape(text)) return text.ToString();
        var builder = new StringBuilder(Math.Min(text.Length, maxLength) + 16);
        foreach (char c in text)
        {
            if (builder.Length >= maxLength) { builder.Append('…'); break; }
            switch (c)
            {
                case '\n': builder.Append("\\n"); break;
                case '\r': builder.Append("\\r"); break;
                case '\t': builder.Append("\\t"); break;
                default:
                    if (char.IsControl(c)) builder.Append("\\u").Append(((int)c).ToString("x4", CultureInfo.InvariantCulture));
                    else if (IsHidden(c)) builder.Append("<U+").Append(((int)c).ToString("X4", CultureInfo.InvariantCulture)).Append('>');
                    else builder.Append(c);
                    break;
            }
        }
        return builder.ToString();
    }

    private static bool NeedsEscape(ReadOnlySpan<char> text)
    {
        foreach (char c in text)
            if (char.IsControl(c) || IsHidden(c)) return true;
        return false;
    }

    /// <summary>Characters that print as nothing yet reorder, hide or break what follows.</summary>
    private static bool IsHidden(char c) => char.GetUnicodeCategory(c) switch
    {
        UnicodeCategory.Format or UnicodeCategory.LineSeparator or UnicodeCategory.ParagraphSeparator => true,
        _ => false,
    };
}
