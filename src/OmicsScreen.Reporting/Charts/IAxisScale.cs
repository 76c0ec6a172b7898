namespace OmicsScreen.Reporting.Charts;

/// <summary>Maps data values on a numeric axis to a fraction of the axis length, and lists its ticks.</summary>
public interface IAxisScale
{
    double Minimum { get; }

    double Maximum { get; }

    IReadOnlyList<AxisTick> Ticks { get; }

    /// <summary>0 at <see cref="Minimum"/>, 1 at <see cref="Maximum"/>; outside [0, 1] for values beyond the axis.</summary>
    double Fraction(double value);

    /// <summary>Whether the value can be placed on this axis at all (finite; positive on a log axis).</summary>
    bool CanShow(double value);
}
