using System.Globalization;
using System.Text;

namespace OmicsScreen.Reporting.Html;

/// <summary>
/// Characters a reader cannot see but that change what is shown: bidirectional overrides and
/// isolates (U+202E turns "gnp.exe" into "exe.png"), zero-width spaces and joiners, the byte-order
/// mark: the Unicode format characters (category Cf). Untrusted names show each as a visible
/// &lt;U+XXXX&gt; on the console and in the report, so two names that look alike can be told apart.
/// </summary>
public static class HiddenCharacters
{
    public static bool IsHidden(char c) => char.GetUnicodeCategory(c) == UnicodeCategory.Format;

    public static bool Contains(string text)
    {
        foreach (char c in text) if (IsHidden(c)) return true;
        return false;
    }

    /// <summary>The visible stand-in of a hidden character, e.g. "&lt;U+202E&gt;".</summary>
    public static string Mark(char c) => "<U+" + ((int)c).ToString("X4", CultureInfo.InvariantCulture) + ">";

    /// <summary>The text with every hidden character replaced by its mark.</summary>
    public static string Reveal(string text)
    {
        if (!Contains(text)) return text;
        var builder = new StringBuilder(text.Length + 16);
        foreach (char c in text)
        {
            if (IsHidden(c)) builder.Append(Mark(c));
            else builder.Append(c);
        }
        return builder.ToString();
    }
}
