using System.Globalization;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// Colours of the charts. Series colours are the Okabe &amp; Ito (2008) palette ("Color Universal
/// Design"), distinguishable under the common forms of colour-vision deficiency; yellow is last
/// because it is faint on white. The diverging scale for correlations runs from Okabe-Ito blue
/// through near-white to Okabe-Ito vermillion, a blue-orange pair that stays apart for deuteranopes
/// and protanopes (unlike red-green).
/// </summary>
public static class ChartPalette
{
    public const string Black = "#000000";
    public const string Orange = "#E69F00";
    public const string SkyBlue = "#56B4E9";
    public const string BluishGreen = "#009E73";
    public const string Yellow = "#F0E442";
    public const string Blue = "#0072B2";
    public const string Vermillion = "#D55E00";
    public const string ReddishPurple = "#CC79A7";

    /// <summary>Grid lines, axes and cells without a value.</summary>
    public const string Grid = "#E3E3E3";
    public const string Axis = "#4D4D4D";
    public const string NoValue = "#BDBDBD";

    /// <summary>Near-white middle of the diverging scale.</summary>
    public const string Neutral = "#F7F7F7";

    private static readonly string[] Series = [Blue, Vermillion, BluishGreen, Orange, ReddishPurple, SkyBlue, Black, Yellow];

    /// <summary>The colour of the series at <paramref name="index"/>, cycling after eight.</summary>
    public static string SeriesColour(int index) => Series[((index % Series.Length) + Series.Length) % Series.Length];

    /// <summary>
    /// Colour of <paramref name="value"/> on a diverging scale from <paramref name="minimum"/> (blue)
    /// through the midpoint (near-white) to <paramref name="maximum"/> (vermillion), by linear
    /// interpolation in sRGB; values beyond the ends are clamped; NaN gives <see cref="NoValue"/>.
    /// </summary>
    public static string Diverging(double value, double minimum = -1, double maximum = 1)
    {
        if (double.IsNaN(value)) return NoValue;
        double middle = (minimum + maximum) / 2;
        double half = (maximum - minimum) / 2;
        double position = Math.Clamp((value - middle) / half, -1, 1);
        return position < 0
            ? Mix(Neutral, Blue, -position)
            : Mix(Neutral, Vermillion, position);
    }

    /// <summary>
    /// True when dark text contrasts more than white with <paramref name="hexColour"/>. With the
    /// WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05), black wins when (L + 0.05) / 0.05 exceeds
    /// 1.05 / (L + 0.05), that is when the relative luminance L exceeds sqrt(0.0525) - 0.05 = 0.179.
    /// </summary>
    internal static bool PrefersDarkText(string hexColour)
    {
        var (red, green, blue) = Parse(hexColour);
        double luminance = 0.2126 * Linear(red) + 0.7152 * Linear(green) + 0.0722 * Linear(blue);
        return luminance > DarkTextLuminance;
    }

    private static readonly double DarkTextLuminance = Math.Sqrt(0.0525) - 0.05;

    private static double Linear(int channel)
    {
        // sRGB transfer function (IEC 61966-2-1).
        double c = channel / 255.0;
        return c <= 0.04045 ? c / 12.92 : Math.Pow((c + 0.055) / 1.055, 2.4);
    }

    private static string Mix(string from, string to, double weight)
    {
        var (r0, g0, b0) = Parse(from);
        var (r1, g1, b1) = Parse(to);
        return string.Create(CultureInfo.InvariantCulture,
            $"#{Channel(r0, r1, weight):X2}{Channel(g0, g1, weight):X2}{Channel(b0, b1, weight):X2}");
    }

    private static int Channel(int from, int to, double weight) =>
        (int)Math.Round(from + (to - from) * weight, MidpointRounding.AwayFromZero);

    private static (int Red, int Green, int Blue) Parse(string hexColour) => (
        int.Parse(hexColour.AsSpan(1, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture),
        int.Parse(hexColour.AsSpan(3, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture),
        int.Parse(hexColour.AsSpan(5, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture));
}
