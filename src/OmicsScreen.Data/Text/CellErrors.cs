namespace OmicsScreen.Data.Text;

/// <summary>The error for a feature cell that is not a measurement, worded the same for every format.</summary>
internal static class CellErrors
{
    public static PanelInputException NotAMeasurement(string filePath, long line, string column, string feature,
        ReadOnlySpan<char> text, CellKind kind, bool isTableRow = false, string? textColumnFix = null, bool textColumnIsSample = false)
    {
        string shown = Display.Name(text);
        string where = column == feature ? "" : $" (feature '{Display.Name(feature)}')";
        if (kind == CellKind.Infinite)
            return PanelInputException.At(filePath, line, column,
                $"found '{shown}'{where}, an infinite value or a number beyond the float32 range (about ±3.4e38).",
                "Infinity is not a measurement: put the measured value, NA when it is missing, or a below-detection token such as <LOD.",
                isTableRow: isTableRow);
        string fix = "Correct the cell. If this column describes samples rather than measuring them, name it with --annotation COLUMN (or with --outcome, --cohort or --subject).";
        if (textColumnFix is not null && (column == feature || textColumnIsSample) && double.IsNaN(LeadingNumber(text)))
            fix = textColumnFix;
        else if (text.Contains('\uFFFD'))
            fix = "The cell holds bytes that are not valid UTF-8 (the file is probably Latin-1 or Windows-1252): save the file again as UTF-8.";
        else if (LooksLikeThousands(text))
            fix = $"'{shown}' may hold a thousands separator or a decimal comma, which cannot be told apart here: write it without the comma ({Without(text, ',')}) if it is a whole number, or with a point ({text.ToString().Replace(',', '.')}) if it is a decimal, and load again.";
        else if (text.Contains(',') && !text.Contains('.'))
            fix = "Write decimals with a point (1.5, not 1,5) and load again.";
        else if (text.Contains(',') && text.Contains('.'))
            fix = "Write numbers without thousands separators and with a decimal point (1234.5, not 1,234.5 or 1.234,5) and load again.";
        return PanelInputException.At(filePath, line, column,
            $"found '{shown}'{where}, which is not a number, a missing-value token (empty, NA, NaN, N/A, null) or a below-detection token (<LOD, <LLOQ, <LOQ, <0.05, BLQ, BLOD).",
            fix, isTableRow: isTableRow);
    }

    /// <summary>NaN when the cell does not start like a number, so a mistyped number is not taken for a text column.</summary>
    private static double LeadingNumber(ReadOnlySpan<char> text)
    {
        var trimmed = text.Trim();
        return trimmed.Length > 0 && (char.IsAsciiDigit(trimmed[0]) || trimmed[0] is '-' or '+' or '.') ? 0 : double.NaN;
    }

    /// <summary>Digits grouped by commas in threes after one to three leading digits ("1,234", "-12,345,678"): thousands or decimals alike.</summary>
    private static bool LooksLikeThousands(ReadOnlySpan<char> text)
    {
        var digits = text.Trim();
        if (digits.Length > 0 && digits[0] is '+' or '-') digits = digits[1..];
        int comma = digits.IndexOf(',');
        if (comma is < 1 or > 3) return false;
        for (int i = 0; i < comma; i++) if (!char.IsAsciiDigit(digits[i])) return false;
        var rest = digits[comma..];
        if (rest.Length % 4 != 0) return false;
        for (int i = 0; i < rest.Length; i++)
            if (i % 4 == 0 ? rest[i] != ',' : !char.IsAsciiDigit(rest[i])) return false;
        return true;
    }

    private static string Without(ReadOnlySpan<char> text, char removed) => text.ToString().Replace(removed.ToString(), "", StringComparison.Ordinal);
}
