using System.Globalization;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// A base-10 logarithmic axis from the power of ten at or below the smallest value to the one at or
/// above the largest. Ticks sit on powers of ten; when the axis spans at most two decades the 2x and
/// 5x multiples are added so the reader has more than two or three reference points.
/// </summary>
public sealed class LogScale : IAxisScale
{
    /// <summary>Above this many decades only every second (third, ...) decade is labelled.</summary>
    private const int MaxLabelledDecades = 8;

    private readonly AxisTick[] _ticks;
    private readonly double _logMinimum;
    private readonly double _logMaximum;

    private LogScale(int lowDecade, int highDecade, AxisTick[] ticks)
    {
        _logMinimum = lowDecade;
        _logMaximum = highDecade;
        Minimum = Math.Pow(10, lowDecade);
        Maximum = Math.Pow(10, highDecade);
        _ticks = ticks;
    }

    public double Minimum { get; }

    public double Maximum { get; }

    public IReadOnlyList<AxisTick> Ticks => _ticks;

    /// <summary>The axis covering the positive data range; non-positive or non-finite limits give 1 to 10.</summary>
    public static LogScale Create(double dataMinimum, double dataMaximum)
    {
        if (!(dataMinimum > 0) || !double.IsFinite(dataMinimum)) dataMinimum = 1;
        if (!(dataMaximum > 0) || !double.IsFinite(dataMaximum)) dataMaximum = Math.Max(dataMinimum, 1);
        if (dataMaximum < dataMinimum) (dataMinimum, dataMaximum) = (dataMaximum, dataMinimum);
        int low = (int)Math.Floor(Math.Log10(dataMinimum));
        int high = (int)Math.Ceiling(Math.Log10(dataMaximum));
        if (high == low) high++;
        int decades = high - low;
        int decadeStep = (decades + MaxLabelledDecades - 1) / MaxLabelledDecades;
        var ticks = new List<AxisTick>();
        for (int decade = low; decade <= high; decade++)
        {
            if ((decade - low) % decadeStep != 0) continue;
            double power = Math.Pow(10, decade);
            ticks.Add(new AxisTick(power, Label(power, decade)));
            if (decades <= 2 && decade < high)
            {
                ticks.Add(new AxisTick(2 * power, Label(2 * power, decade)));
                ticks.Add(new AxisTick(5 * power, Label(5 * power, decade)));
            }
        }
        return new LogScale(low, high, ticks.ToArray());
    }

    public double Fraction(double value) => (Math.Log10(value) - _logMinimum) / (_logMaximum - _logMinimum);

    public bool CanShow(double value) => value > 0 && double.IsFinite(value);

    // Plain decimals between 0.001 and 10000 read easiest; beyond them, exponent form ("1e-05") stays short.
    private static string Label(double value, int decade) =>
        decade is >= -3 and <= 4
            ? value.ToString(decade < 0 ? "0.###" : "0", CultureInfo.InvariantCulture)
            : value.ToString("0e+00", CultureInfo.InvariantCulture);
}
