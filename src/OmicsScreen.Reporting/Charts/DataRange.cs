namespace OmicsScreen.Reporting.Charts;

/// <summary>The smallest and largest finite values seen, for sizing an axis; empty until a value arrives.</summary>
internal struct DataRange
{
    public DataRange()
    {
    }

    public double Minimum { get; private set; } = double.PositiveInfinity;

    public double Maximum { get; private set; } = double.NegativeInfinity;

    public readonly bool IsEmpty => Minimum > Maximum;

    /// <summary>Adds a value; NaN and infinities are ignored, and so are non-positive values when <paramref name="positiveOnly"/>.</summary>
    public void Include(double value, bool positiveOnly = false)
    {
        if (!double.IsFinite(value) || (positiveOnly && value <= 0)) return;
        if (value < Minimum) Minimum = value;
        if (value > Maximum) Maximum = value;
    }

    public void Include(IReadOnlyList<double>? values, bool positiveOnly = false)
    {
        if (values is null) return;
        for (int i = 0; i < values.Count; i++) Include(values[i], positiveOnly);
    }

    /// <summary>The axis for this range.</summary>
    public readonly IAxisScale Scale(AxisScaleKind kind) => kind == AxisScaleKind.Log10
        ? LogScale.Create(Minimum, Maximum)
        : LinearScale.Nice(Minimum, Maximum);
}
