namespace OmicsScreen.TestSupport;

/// <summary>
/// Kolmogorov-Smirnov distances and their asymptotic critical values, for tests of calibration.
/// </summary>
/// <remarks>
/// Critical value of the two-sided test at level alpha: c(alpha) sqrt((n + m) / (n m)) with
/// c(alpha) = sqrt(-ln(alpha / 2) / 2) (Smirnov's asymptotic distribution; the usual table gives
/// c(0.05) = 1.358, c(0.01) = 1.628, c(0.001) = 1.949). One-sample: m taken to infinity.
/// </remarks>
public static class KolmogorovSmirnov
{
    /// <summary>sup |F_n(x) - x| of a sample against U(0, 1).</summary>
    public static double DistanceFromUniform(IEnumerable<double> sample)
    {
        var sorted = sample.ToArray();
        Array.Sort(sorted);
        int count = sorted.Length;
        double distance = 0;
        for (int i = 0; i < count; i++)
        {
            double x = Math.Clamp(sorted[i], 0, 1);
            distance = Math.Max(distance, Math.Max((i + 1.0) / count - x, x - (double)i / count));
        }
        return distance;
    }

    /// <summary>sup |F_a(x) - F_b(x)| of two samples.</summary>
    public static double TwoSampleDistance(IEnumerable<double> first, IEnumerable<double> second)
    {
        var a = first.ToArray();
        var b = second.ToArray();
        Array.Sort(a);
        Array.Sort(b);
        int i = 0, j = 0;
        double distance = 0;
        while (i < a.Length && j < b.Length)
        {
            double x = Math.Min(a[i], b[j]);
            while (i < a.Length && a[i] <= x) i++;
            while (j < b.Length && b[j] <= x) j++;
            distance = Math.Max(distance, Math.Abs((double)i / a.Length - (double)j / b.Length));
        }
        return distance;
    }

    /// <summary>Critical distance of the two-sided test at <paramref name="alpha"/>; <paramref name="second"/> = 0 for the one-sample test.</summary>
    public static double CriticalDistance(double alpha, int first, int second = 0)
    {
        double c = Math.Sqrt(-Math.Log(alpha / 2) / 2);
        return second == 0 ? c / Math.Sqrt(first) : c * Math.Sqrt((first + (double)second) / ((double)first * second));
    }
}
