using System.Text;

namespace OmicsScreen.Reporting.Html;

/// <summary>
/// Encodes untrusted text (feature, sample, class and cohort names, file names) for HTML and SVG
/// element content and quoted attribute values. One encoder for both, so a name is safe wherever it
/// lands.
/// </summary>
/// <remarks>
/// Escapes the five characters with markup meaning (&amp; &lt; &gt; " ') as in the OWASP XSS
/// prevention guidance, and replaces characters XML 1.0 forbids (C0 controls other than tab, line
/// feed and carriage return; U+FFFE, U+FFFF; unpaired surrogates) with U+FFFD, so the report stays
/// well-formed XHTML and an SVG chart stays parseable XML. Hidden format characters (bidirectional
/// overrides, zero-width spaces; <see cref="HiddenCharacters"/>) are shown as a visible &lt;U+XXXX&gt;.
/// Everything else, including non-ASCII letters, is kept as is: the document is UTF-8.
/// </remarks>
public static class MarkupText
{
    public const char ReplacementCharacter = '\uFFFD';

    public static string Encode(string? text)
    {
        if (string.IsNullOrEmpty(text)) return string.Empty;
        if (!NeedsEncoding(text)) return text;
        var builder = new StringBuilder(text.Length + 16);
        AppendEncoded(builder, text);
        return builder.ToString();
    }

    public static void AppendEncoded(StringBuilder builder, string? text)
    {
        ArgumentNullException.ThrowIfNull(builder);
        if (string.IsNullOrEmpty(text)) return;
        for (int i = 0; i < text.Length; i++)
        {
            char c = text[i];
            switch (c)
            {
                case '&': builder.Append("&amp;"); break;
                case '<': builder.Append("&lt;"); break;
                case '>': builder.Append("&gt;"); break;
                case '"': builder.Append("&quot;"); break;
                case '\'': builder.Append("&#39;"); break;
                default:
                    if (char.IsHighSurrogate(c) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1]))
                    {
                        builder.Append(c).Append(text[i + 1]);
                        i++;
                    }
                    else if (HiddenCharacters.IsHidden(c))
                    {
                        builder.Append("&lt;U+").Append(((int)c).ToString("X4", System.Globalization.CultureInfo.InvariantCulture)).Append("&gt;");
                    }
                    else
                    {
                        builder.Append(IsXmlCharacter(c) ? c : ReplacementCharacter);
                    }
                    break;
            }
        }
    }

    private static bool NeedsEncoding(string text)
    {
        foreach (char c in text)
        {
            if (c is '&' or '<' or '>' or '"' or '\'' || char.IsSurrogate(c) || !IsXmlCharacter(c) || HiddenCharacters.IsHidden(c)) return true;
        }
        return false;
    }

    // XML 1.0 Char production: #x9 | #xA | #xD | [#x20-#xD7FF] | [#xE000-#xFFFD] (surrogate pairs handled by the caller).
    private static bool IsXmlCharacter(char c) =>
        c is '\t' or '\n' or '\r' || (c >= '\u0020' && c <= '\uD7FF') || (c >= '\uE000' && c <= '\uFFFD');
}
