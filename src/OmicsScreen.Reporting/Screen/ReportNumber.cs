using System.Globalization;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// Numbers as the report prints them for people: invariant culture, a stated number of decimals or
/// significant digits, and "n/a" for a value that does not exist (NaN), since a person reads "NA"
/// as an abbreviation rather than a gap.
/// </summary>
internal static class ReportNumber
{
    public const string Missing = "n/a";

    public static string Fixed(double value, int decimals) =>
        double.IsFinite(value) ? value.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture) : NonFinite(value);

    /// <summary>Significant digits, in exponent form outside [1e-4, 1e6) so small importances stay legible.</summary>
    public static string Significant(double value, int digits)
    {
        if (!double.IsFinite(value)) return NonFinite(value);
        if (value == 0) return "0";
        double magnitude = Math.Abs(value);
        string format = magnitude < 1e-4 || magnitude >= 1e6 ? "E" + (digits - 1).ToString(CultureInfo.InvariantCulture) : "G" + digits.ToString(CultureInfo.InvariantCulture);
        return value.ToString(format, CultureInfo.InvariantCulture);
    }

    public static string Percent(double fraction, int decimals = 1) =>
        double.IsFinite(fraction) ? Fixed(100 * fraction, decimals) + "%" : NonFinite(fraction);

    public static string Integer(long value) => value.ToString(CultureInfo.InvariantCulture);

    /// <summary>Mean ± SD with the same significant digits for both.</summary>
    public static string MeanSd(double mean, double sd, int digits = 3) =>
        double.IsNaN(sd) ? Significant(mean, digits) : Significant(mean, digits) + " ± " + Significant(sd, 2);

    public static string Seconds(double seconds) => Fixed(seconds, 1) + " s";

    private static string NonFinite(double value) =>
        double.IsNaN(value) ? Missing : double.IsPositiveInfinity(value) ? "∞" : "−∞";
}
