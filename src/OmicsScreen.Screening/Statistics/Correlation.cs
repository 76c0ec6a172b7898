namespace OmicsScreen.Screening.Statistics;

/// <summary>Pearson and Spearman correlation over the pairwise-complete observations.</summary>
/// <remarks>
/// A pair is used only when both values are present (not NaN), so two features with different
/// missing cells are compared on the samples they share. Fewer than two complete pairs, or no
/// spread in either variable, gives NaN.
/// </remarks>
public static class Correlation
{
    /// <summary>Pearson's product-moment correlation, from centred sums (two passes, no cancellation).</summary>
    public static double Pearson(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != y.Length) throw new ArgumentException("Both variables need one value per sample.");
        var (completeX, completeY) = CompletePairs(x, y);
        return PearsonOfComplete(completeX, completeY);
    }

    /// <summary>
    /// Spearman's rho: Pearson's correlation of the average ranks (ties share their midrank), the
    /// ranks taken within the complete pairs.
    /// </summary>
    public static double Spearman(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != y.Length) throw new ArgumentException("Both variables need one value per sample.");
        var (completeX, completeY) = CompletePairs(x, y);
        if (completeX.Length < 2) return double.NaN;
        return PearsonOfComplete(Ranking.Rank(completeX), Ranking.Rank(completeY));
    }

    private static (double[] X, double[] Y) CompletePairs(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int complete = 0;
        for (int i = 0; i < x.Length; i++)
            if (!double.IsNaN(x[i]) && !double.IsNaN(y[i])) complete++;
        var keptX = new double[complete];
        var keptY = new double[complete];
        int next = 0;
        for (int i = 0; i < x.Length; i++)
        {
            if (double.IsNaN(x[i]) || double.IsNaN(y[i])) continue;
            keptX[next] = x[i];
            keptY[next] = y[i];
            next++;
        }
        return (keptX, keptY);
    }

    private static double PearsonOfComplete(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int count = x.Length;
        if (count < 2) return double.NaN;
        double sumX = 0, sumY = 0;
        for (int i = 0; i < count; i++)
        {
            sumX += x[i];
            sumY += y[i];
        }
        double meanX = sumX / count, meanY = sumY / count;
        double sxx = 0, syy = 0, sxy = 0;
        for (int i = 0; i < count; i++)
        {
            double dx = x[i] - meanX, dy = y[i] - meanY;
            sxx += dx * dx;
            syy += dy * dy;
            sxy += dx * dy;
        }
        if (!(sxx > 0 && syy > 0)) return double.NaN;
        return Math.Clamp(sxy / Math.Sqrt(sxx * syy), -1.0, 1.0);
    }
}
