namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// "Nice" axis ranges and tick steps: 1, 2 or 5 times a power of ten, from Heckbert (1990),
/// "Nice numbers for graph labels", Graphics Gems I, pp. 61-63.
/// </summary>
public static class NiceNumbers
{
    /// <summary>
    /// A nice number near <paramref name="value"/> (which must be positive and finite). With
    /// <paramref name="round"/> the nearest of 1, 2, 5, 10 times the power of ten (cut points 1.5,
    /// 3, 7); without, the smallest of them not below the value (Heckbert 1990, nicenum).
    /// </summary>
    public static double NiceNumber(double value, bool round)
    {
        if (!(value > 0) || !double.IsFinite(value)) throw new ArgumentOutOfRangeException(nameof(value), value, "A nice number needs a positive finite value.");
        double exponent = Math.Floor(Math.Log10(value));
        double power = Math.Pow(10, exponent);
        double fraction = value / power;
        double niceFraction = round
            ? fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10
            : fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10;
        return niceFraction * power;
    }

    /// <summary>
    /// Heckbert's "loose labelling": an axis from a multiple of the step at or below
    /// <paramref name="minimum"/> to one at or above <paramref name="maximum"/>, with about
    /// <paramref name="targetTickCount"/> ticks, and the decimals its labels need.
    /// </summary>
    public static NiceTickRange LooseTicks(double minimum, double maximum, int targetTickCount = 5)
    {
        if (!double.IsFinite(minimum) || !double.IsFinite(maximum)) throw new ArgumentException("Axis limits must be finite.");
        if (maximum < minimum) (minimum, maximum) = (maximum, minimum);
        ArgumentOutOfRangeException.ThrowIfLessThan(targetTickCount, 2);
        if (maximum == minimum)
        {
            // A single value still needs an axis: widen it by a tenth of its size, or by one around zero.
            double half = minimum == 0 ? 1 : Math.Abs(minimum) * 0.1;
            minimum -= half;
            maximum += half;
        }
        double range = NiceNumber(maximum - minimum, round: false);
        double step = NiceNumber(range / (targetTickCount - 1), round: true);
        double first = Math.Floor(minimum / step) * step;
        double last = Math.Ceiling(maximum / step) * step;
        int fractionDigits = Math.Max(0, -(int)Math.Floor(Math.Log10(step)));
        return new NiceTickRange(first, last, step, fractionDigits);
    }
}
