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
        var values = new List<double>();
        for (int decade = low; decade <= high; decade++)
        {
            if ((decade - low) % decadeStep != 0) continue;
            double power = Math.Pow(10, decade);
            values.Add(power);
            if (decades <= 2 && decade < high)
            {
                values.Add(2 * power);
                values.Add(5 * power);
            }
        }
        var labels = ChartNumber.TickLabels(values, fractionDigits: -1);
        var ticks = new AxisTick[values.Count];
        for (int i = 0; i < ticks.Length; i++) ticks[i] = new AxisTick(values[i], labels[i]);
        return new LogScale(low, high, ticks);
    }

    public double Fraction(double value) => (Math.Log10(value) - _logMinimum) / (_logMaximum - _logMinimum);

    public bool CanShow(double value) => value > 0 && double.IsFinite(value);

}
