using System.Globalization;
using OmicsScreen.Reporting.Tables;

namespace OmicsScreen.Reporting.Charts;

/// <summary>Invariant number text for chart markup and chart labels.</summary>
internal static class ChartNumber
{
    /// <summary>A coordinate rounded to two decimals, without trailing zeros or a sign on zero.</summary>
    public static string Coordinate(double value)
    {
        if (!double.IsFinite(value)) throw new ArgumentException("A chart coordinate must be finite; the chart should have skipped this value.", nameof(value));
        double rounded = Math.Round(value, 2, MidpointRounding.AwayFromZero);
        if (rounded == 0) rounded = 0; // turns -0 into 0
        return rounded.ToString("0.##", CultureInfo.InvariantCulture);
    }

    /// <summary>
    /// The labels of one axis's ticks, all in one form: plain decimals (with
    /// <paramref name="fractionDigits"/> digits, or up to three when negative), or, when any tick
    /// is 100,000 or more or under 0.001, all in exponent form ("5e+04", "1e+06"), so one axis
    /// never mixes 50000 with 1e+06.
    /// </summary>
    public static string[] TickLabels(IReadOnlyList<double> values, int fractionDigits)
    {
        bool exponent = false;
        foreach (double value in values)
            if (value != 0 && (Math.Abs(value) >= 1e5 || Math.Abs(value) < 1e-3)) exponent = true;
        var labels = new string[values.Count];
        for (int i = 0; i < labels.Length; i++)
        {
            double value = values[i];
            labels[i] = exponent
                ? (value == 0 ? "0" : value.ToString("0.##e+00", CultureInfo.InvariantCulture))
                : fractionDigits >= 0 ? Fixed(value, fractionDigits) : value.ToString("0.###", CultureInfo.InvariantCulture);
        }
        return labels;
    }

    /// <summary>A value label with a fixed count of decimals, as the tables write it ("NA" when missing).</summary>
    public static string Fixed(double value, int decimals) => NumberFormat.Fixed(decimals).Format(value);
}
