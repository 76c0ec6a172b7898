using System.Globalization;

namespace OmicsScreen.Reporting.Tables;

/// <summary>
/// How a number column is written: every column states its choice, so a reader knows whether a
/// cell is exact or rounded for display. Always invariant culture; a missing value (NaN) is
/// written as <see cref="MissingText"/>.
/// </summary>
public readonly record struct NumberFormat
{
    /// <summary>
    /// Text for a missing number. "NA" rather than an empty cell: R's read.delim and pandas'
    /// read_csv both read it as missing by default (common practice), and a person scanning the
    /// table sees that the value is absent rather than lost.
    /// </summary>
    public const string MissingText = "NA";

    /// <summary>Text for positive and negative infinity (R's spelling; pandas reads it too, from memory).</summary>
    public const string PositiveInfinityText = "Inf";
    public const string NegativeInfinityText = "-Inf";

    private NumberFormat(NumberFormatKind kind, int digits)
    {
        Kind = kind;
        Digits = digits;
    }

    public NumberFormatKind Kind { get; }

    /// <summary>Significant digits or decimals, by <see cref="Kind"/>; 0 for round-trip.</summary>
    public int Digits { get; }

    /// <summary>The shortest text that parses back to the same double: exact, for machine reading.</summary>
    public static NumberFormat RoundTrip { get; } = new(NumberFormatKind.RoundTrip, 0);

    /// <summary>A fixed count of significant digits (1 to 17), switching to exponent form for very small or large values.</summary>
    public static NumberFormat Significant(int digits)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(digits, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(digits, 17);
        return new(NumberFormatKind.SignificantDigits, digits);
    }

    /// <summary>A fixed count of decimals (0 to 15), for bounded quantities such as an AUC or a percentage.</summary>
    public static NumberFormat Fixed(int decimals)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(decimals);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(decimals, 15);
        return new(NumberFormatKind.FixedDecimals, decimals);
    }

    /// <summary>Formats <paramref name="value"/> into <paramref name="destination"/> without allocating.</summary>
    /// <returns>False when the destination is too short.</returns>
    public bool TryFormat(double value, Span<char> destination, out int written)
    {
        if (double.IsNaN(value)) return TryCopy(MissingText, destination, out written);
        if (double.IsPositiveInfinity(value)) return TryCopy(PositiveInfinityText, destination, out written);
        if (double.IsNegativeInfinity(value)) return TryCopy(NegativeInfinityText, destination, out written);
        Span<char> specifier = stackalloc char[3];
        int specifierLength = WriteSpecifier(specifier);
        if (!value.TryFormat(destination, out written, specifier[..specifierLength], CultureInfo.InvariantCulture))
            return false;
        // A rounded negative value can print as "-0" or "-0.000"; a sign on zero only confuses a
        // reader, so it is dropped. Round-trip output keeps it: -0.0 is a distinct double there.
        if (Kind != NumberFormatKind.RoundTrip && written > 1 && destination[0] == '-' && IsZeroText(destination[1..written]))
        {
            destination[1..written].CopyTo(destination);
            written--;
        }
        return true;
    }

    /// <summary>Formats <paramref name="value"/> as a new string (for one-off use outside loops).</summary>
    public string Format(double value)
    {
        Span<char> buffer = stackalloc char[64];
        return TryFormat(value, buffer, out int written) ? new string(buffer[..written]) : throw new InvalidOperationException("Number text longer than 64 characters.");
    }

    private int WriteSpecifier(Span<char> specifier)
    {
        specifier[0] = Kind switch
        {
            NumberFormatKind.RoundTrip => 'R',
            NumberFormatKind.SignificantDigits => 'G',
            _ => 'F',
        };
        if (Kind == NumberFormatKind.RoundTrip) return 1;
        Digits.TryFormat(specifier[1..], out int digitChars, default, CultureInfo.InvariantCulture);
        return 1 + digitChars;
    }

    private static bool IsZeroText(ReadOnlySpan<char> text)
    {
        foreach (char c in text)
        {
            // Exponent form of zero never occurs ("G" prints zero as "0"), so digits and the point suffice.
            if (c != '0' && c != '.') return false;
        }
        return true;
    }

    private static bool TryCopy(string text, Span<char> destination, out int written)
    {
        written = text.Length;
        return text.AsSpan().TryCopyTo(destination);
    }
}
