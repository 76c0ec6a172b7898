namespace OmicsScreen.Screening.Statistics;

/// <summary>A two-sided interval and the coverage it was built for.</summary>
public readonly record struct ConfidenceInterval(double Lower, double Upper, double Level)
{
    public static ConfidenceInterval Undefined(double level) => new(double.NaN, double.NaN, level);
}
