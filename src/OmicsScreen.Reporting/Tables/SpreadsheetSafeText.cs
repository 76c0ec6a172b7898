using System.Text;

namespace OmicsScreen.Reporting.Tables;

/// <summary>
/// Makes an untrusted name (feature, sample, class, cohort) safe as one TSV cell: it cannot break
/// the row structure and a spreadsheet will not run it as a formula.
/// </summary>
/// <remarks>
/// Follows the OWASP "CSV Injection" guidance: a cell beginning with '=', '+', '-', '@', tab or
/// carriage return is prefixed with a single quote, so spreadsheet programs show it as text. The
/// full-width forms (U+FF1D, U+FF0B, U+FF0D, U+FF20) are treated the same because some spreadsheet
/// programs normalise them to the ASCII operators. Leading spaces do not hide a trigger: the check
/// looks past them. Tabs, line breaks and every other control or line/paragraph separator character
/// become a single space, so one name is always one cell. A name a table reader would misread is
/// prefixed the same way: one that reads as a missing value (NA, NaN, N/A, null, the forms the
/// loader treats as missing) and one starting with a double quote, which readers take for the
/// start of a quoted field. Apply this to text only, never to numbers: "-0.5" written by a number
/// column is data, not a formula, and "NA" written by a number column is a missing number.
/// </remarks>
public static class SpreadsheetSafeText
{
    /// <summary>The quote put in front of a formula-like cell.</summary>
    public const char NeutralisingPrefix = '\'';

    /// <summary>The sanitised cell text; returns the same instance when nothing needed changing.</summary>
    public static string Sanitise(string? text)
    {
        if (string.IsNullOrEmpty(text)) return string.Empty;
        bool needsPrefix = StartsLikeFormula(text) || ReadsAsMissing(text) || text[0] == '"';
        bool needsReplacement = false;
        foreach (char c in text)
        {
            if (IsBreaking(c)) { needsReplacement = true; break; }
        }
        if (!needsPrefix && !needsReplacement) return text;

        var builder = new StringBuilder(text.Length + 1);
        if (needsPrefix) builder.Append(NeutralisingPrefix);
        foreach (char c in text) builder.Append(IsBreaking(c) ? ' ' : c);
        return builder.ToString();
    }

    /// <summary>True when a spreadsheet could read the cell as a formula.</summary>
    public static bool StartsLikeFormula(string text)
    {
        if (text.Length == 0) return false;
        // OWASP lists a leading tab or carriage return as triggers in their own right.
        if (text[0] == '\t' || text[0] == '\r') return true;
        int first = 0;
        while (first < text.Length && (char.IsWhiteSpace(text[first]) || char.IsControl(text[first]))) first++;
        return first < text.Length && IsFormulaTrigger(text[first]);
    }

    /// <summary>True when a table reader would take the cell for a missing value.</summary>
    public static bool ReadsAsMissing(string text)
    {
        var trimmed = text.AsSpan().Trim();
        foreach (var token in MissingTokens)
            if (trimmed.Equals(token, StringComparison.OrdinalIgnoreCase)) return true;
        return false;
    }

    // The loader's missing forms (README, input formats) and R's and pandas' defaults among them.
    private static readonly string[] MissingTokens = ["NA", "NaN", "N/A", "null", "NULL", "#N/A", "None", "nan", "-nan", "<NA>"];

    private static bool IsFormulaTrigger(char c) => c is '=' or '+' or '-' or '@'
        or '\uFF1D' or '\uFF0B' or '\uFF0D' or '\uFF20';

    // Control characters include tab, CR, LF and NEL (U+0085); U+2028/U+2029 end a line in some readers.
    private static bool IsBreaking(char c) => char.IsControl(c) || c is '\u2028' or '\u2029';
}
