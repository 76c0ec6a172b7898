namespace OmicsScreen.Reporting.Charts;

/// <summary>A linear axis whose ends and ticks are nice numbers (Heckbert 1990).</summary>
public sealed class LinearScale : IAxisScale
{
    private readonly AxisTick[] _ticks;

    private LinearScale(double minimum, double maximum, AxisTick[] ticks)
    {
        Minimum = minimum;
        Maximum = maximum;
        _ticks = ticks;
    }

    public double Minimum { get; }

    public double Maximum { get; }

    public IReadOnlyList<AxisTick> Ticks => _ticks;

    /// <summary>
    /// The loosely labelled axis covering [<paramref name="dataMinimum"/>, <paramref name="dataMaximum"/>].
    /// Non-finite limits (no data) give the axis 0 to 1.
    /// </summary>
    public static LinearScale Nice(double dataMinimum, double dataMaximum, int targetTickCount = 5)
    {
        if (!double.IsFinite(dataMinimum) || !double.IsFinite(dataMaximum)) (dataMinimum, dataMaximum) = (0, 1);
        var range = NiceNumbers.LooseTicks(dataMinimum, dataMaximum, targetTickCount);
        int count = range.TickCount;
        var values = new double[count];
        for (int i = 0; i < count; i++) values[i] = range.Tick(i);
        var labels = ChartNumber.TickLabels(values, range.FractionDigits);
        var ticks = new AxisTick[count];
        for (int i = 0; i < count; i++) ticks[i] = new AxisTick(values[i], labels[i]);
        return new LinearScale(range.First, range.Last, ticks);
    }

    /// <summary>
    /// Nice ticks inside fixed ends, for quantities with natural limits (an AUC from 0 to 1, a
    /// frequency from 0 to 1): the axis is exactly [minimum, maximum].
    /// </summary>
    public static LinearScale Fixed(double minimum, double maximum, int targetTickCount = 5)
    {
        if (!(maximum > minimum) || !double.IsFinite(minimum) || !double.IsFinite(maximum))
            throw new ArgumentException("A fixed axis needs finite limits with maximum above minimum.");
        var range = NiceNumbers.LooseTicks(minimum, maximum, targetTickCount);
        var values = new List<double>(range.TickCount);
        double tolerance = range.Step * 1e-9;
        for (int i = 0; i < range.TickCount; i++)
        {
            double value = range.Tick(i);
            if (value >= minimum - tolerance && value <= maximum + tolerance) values.Add(value);
        }
        var labels = ChartNumber.TickLabels(values, range.FractionDigits);
        var ticks = new AxisTick[values.Count];
        for (int i = 0; i < ticks.Length; i++) ticks[i] = new AxisTick(values[i], labels[i]);
        return new LinearScale(minimum, maximum, ticks);
    }

    public double Fraction(double value) => (value - Minimum) / (Maximum - Minimum);

    public bool CanShow(double value) => double.IsFinite(value);
}
