using System.Globalization;
using System.Runtime.CompilerServices;
using csFastFloat;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Text;

/// <summary>
/// The token rules for one text cell of a feature, shared by every format that stores cells as
/// text (CSV, TSV, and text columns of Parquet or Arrow files), so that all formats agree.
/// </summary>
/// <remarks>
/// Missing: empty, NA, NaN, N/A, null. Below detection: &lt;LOD, &lt;LLOQ, &lt;LOQ, BLQ, BLOD (no
/// limit known) and &lt;number (the limit is kept as the value). All tokens are case-insensitive and
/// surrounding spaces are ignored. Numbers use the invariant culture: a point as decimal
/// separator, optional exponent, no thousands separators.
/// </remarks>
internal static class CellText
{
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static CellKind Classify(ReadOnlySpan<char> text, out float value)
    {
        // Fast path for the common cell, a bare number: no trimming, no token comparisons.
        if (!text.IsEmpty && char.IsAsciiDigit(text[^1])
            && FastFloatParser.TryParseFloat(text, out int consumed, out value, NumberStyles.Float, '.')
            && consumed == text.Length && float.IsFinite(value))
            return CellKind.Measured;
        return ClassifySlow(text, out value);
    }

    private static CellKind ClassifySlow(ReadOnlySpan<char> text, out float value)
    {
        text = text.Trim(' ');
        value = float.NaN;
        if (text.IsEmpty) return CellKind.Missing;
        char first = text[0];
        if (char.IsAsciiDigit(first) || first == '-' || first == '+' || first == '.')
        {
            if (TryParseWhole(text, out value))
                return float.IsFinite(value) ? CellKind.Measured : FiniteOrInfinite(value);
            return KnownToken(text);
        }
        if (first == '<')
        {
            var limitText = text[1..].TrimStart(' ');
            if (limitText.Equals("LOD", StringComparison.OrdinalIgnoreCase)
                || limitText.Equals("LLOQ", StringComparison.OrdinalIgnoreCase)
                || limitText.Equals("LOQ", StringComparison.OrdinalIgnoreCase))
                return CellKind.BelowDetection;
            if (TryParseWhole(limitText, out float limit) && float.IsFinite(limit))
            {
                value = limit;
                return CellKind.BelowDetection;
            }
            return CellKind.NotANumber;
        }
        return KnownToken(text);
    }

    /// <summary>A NaN from a number parser means the text spelled NaN, which counts as missing.</summary>
    private static CellKind FiniteOrInfinite(float value) =>
        float.IsNaN(value) ? CellKind.Missing : CellKind.Infinite;

    private static bool TryParseWhole(ReadOnlySpan<char> text, out float value)
    {
        if (FastFloatParser.TryParseFloat(text, out int consumed, out value, NumberStyles.Float, '.')
            && consumed == text.Length)
            return true;
        value = float.NaN;
        return false;
    }

    private static CellKind KnownToken(ReadOnlySpan<char> text)
    {
        if (text.Equals("NA", StringComparison.OrdinalIgnoreCase)
            || text.Equals("NaN", StringComparison.OrdinalIgnoreCase)
            || text.Equals("N/A", StringComparison.OrdinalIgnoreCase)
            || text.Equals("null", StringComparison.OrdinalIgnoreCase))
            return CellKind.Missing;
        if (text.Equals("BLQ", StringComparison.OrdinalIgnoreCase)
            || text.Equals("BLOD", StringComparison.OrdinalIgnoreCase))
            return CellKind.BelowDetection;
        var unsigned = text[0] is '+' or '-' ? text[1..] : text;
        if (unsigned.Equals("inf", StringComparison.OrdinalIgnoreCase)
            || unsigned.Equals("infinity", StringComparison.OrdinalIgnoreCase)
            || unsigned.SequenceEqual("∞"))
            return CellKind.Infinite;
        return CellKind.NotANumber;
    }

    /// <summary>
    /// A cell as text that <see cref="Classify"/> reads back to the same state and bits:
    /// shortest round-trip number, "NA" for missing, "&lt;limit" or "&lt;LOD" for censored.
    /// </summary>
    public static string Format(CellState state, float value) => state switch
    {
        CellState.Missing => "NA",
        CellState.BelowDetection => float.IsNaN(value) ? "<LOD" : "<" + value.ToString("R", CultureInfo.InvariantCulture),
        _ => value.ToString("R", CultureInfo.InvariantCulture),
    };
}
