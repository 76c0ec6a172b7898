namespace OmicsScreen.Screening.Statistics;

/// <summary>Sample quantiles of an ascending sample under an explicit definition.</summary>
public static class Quantile
{
    /// <summary>
    /// The <paramref name="probability"/> quantile of <paramref name="sortedValues"/>, which the caller
    /// guarantees is ascending and free of NaN; NaN for an empty sample.
    /// </summary>
    public static double OfSorted(ReadOnlySpan<double> sortedValues, double probability, QuantileDefinition definition)
    {
        if (!(probability >= 0 && probability <= 1)) throw new ArgumentOutOfRangeException(nameof(probability));
        int count = sortedValues.Length;
        if (count == 0) return double.NaN;
        switch (definition)
        {
            case QuantileDefinition.InverseEmpiricalCdf:
                {
                    int rank = (int)Math.Ceiling(probability * count);
                    return sortedValues[Math.Clamp(rank, 1, count) - 1];
                }
            case QuantileDefinition.Weibull:
                return Interpolate(sortedValues, probability * (count + 1));
            case QuantileDefinition.Linear:
                return Interpolate(sortedValues, 1 + probability * (count - 1));
            default:
                throw new ArgumentOutOfRangeException(nameof(definition));
        }
    }

    /// <summary>The sample median (mean of the two middle values for an even count) of an ascending sample.</summary>
    public static double MedianOfSorted(ReadOnlySpan<double> sortedValues) =>
        OfSorted(sortedValues, 0.5, QuantileDefinition.Linear);

    /// <summary>Linear interpolation between order statistics at a 1-based, possibly fractional, position.</summary>
    private static double Interpolate(ReadOnlySpan<double> sortedValues, double position)
    {
        int count = sortedValues.Length;
        if (position <= 1) return sortedValues[0];
        if (position >= count) return sortedValues[count - 1];
        int below = (int)Math.Floor(position);
        double fraction = position - below;
        double low = sortedValues[below - 1], high = sortedValues[below];
        return fraction == 0 ? low : low + fraction * (high - low);
    }
}
