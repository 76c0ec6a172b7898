namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>How far a pooled set of null p-values is from U(0, 1).</summary>
public static class PValueUniformity
{
    /// <summary>
    /// The Kolmogorov-Smirnov distance sup |F_m(p) - p| of the empirical distribution of the
    /// p-values to U(0, 1): max over sorted p_(i) of i/m - p_(i) and p_(i) - (i-1)/m (Kolmogorov 1933;
    /// the formula holds with ties, since the largest i of a tied run gives the first term and the
    /// smallest the second). NaN for no p-values.
    /// </summary>
    public static double KolmogorovSmirnovDistance(IReadOnlyList<double> pValues)
    {
        var sorted = pValues.Where(p => !double.IsNaN(p)).Order().ToArray();
        int count = sorted.Length;
        if (count == 0) return double.NaN;
        double distance = 0;
        for (int i = 0; i < count; i++)
            distance = Math.Max(distance, Math.Max((i + 1.0) / count - sorted[i], sorted[i] - (double)i / count));
        return distance;
    }

    /// <summary>
    /// 1.358 / sqrt(m), the asymptotic 5% critical value of the distance for m independent
    /// p-values (Smirnov 1948, common practice). Features in correlated blocks are not
    /// independent, so pooled distances may exceed it under a valid null; read it as a scale.
    /// </summary>
    public static double CriticalDistance(int count) => 1.358 / Math.Sqrt(count);

    /// <summary>Share of p-values at or below the level.</summary>
    public static double ShareAtOrBelow(IReadOnlyList<double> pValues, double level)
    {
        int tested = 0, below = 0;
        foreach (double p in pValues)
        {
            if (double.IsNaN(p)) continue;
            tested++;
            if (p <= level) below++;
        }
        return tested == 0 ? double.NaN : (double)below / tested;
    }

    /// <summary>The median of the p-values (mean of the two middle values for an even count); NaN for none.</summary>
    public static double Median(IReadOnlyList<double> pValues)
    {
        var sorted = pValues.Where(p => !double.IsNaN(p)).Order().ToArray();
        if (sorted.Length == 0) return double.NaN;
        int middle = sorted.Length / 2;
        return sorted.Length % 2 == 1 ? sorted[middle] : 0.5 * (sorted[middle - 1] + sorted[middle]);
    }
}
