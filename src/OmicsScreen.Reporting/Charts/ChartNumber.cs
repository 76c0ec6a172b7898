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

    /// <summary>A value label with a fixed count of decimals, as the tables write it ("NA" when missing).</summary>
    public static string Fixed(double value, int decimals) => NumberFormat.Fixed(decimals).Format(value);
}
