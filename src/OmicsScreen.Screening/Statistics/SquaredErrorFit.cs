namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// How far predictions of a measured outcome fall from the observed values: the residual and total
/// sums of squares (the total about the observed values' own mean), R² and the root mean squared
/// error, as scikit-learn's r2_score and mean_squared_error compute them.
/// </summary>
/// <remarks>
/// One pass for the mean, one for both sums, each in sample order: the tables written before this
/// type existed used exactly these sums, so they stay byte-identical.
/// </remarks>
public readonly record struct SquaredErrorFit(int Count, double ResidualSumOfSquares, double TotalSumOfSquares)
{
    /// <summary>1 - residual / total: 0 for predictions no better than the observed mean, negative for worse; NaN when the outcome does not vary.</summary>
    public double RSquared => TotalSumOfSquares > 0 ? 1 - ResidualSumOfSquares / TotalSumOfSquares : double.NaN;

    /// <summary>The residual sum of squares over the count; NaN for no samples.</summary>
    public double MeanSquaredError => Count > 0 ? ResidualSumOfSquares / Count : double.NaN;

    /// <summary>The square root of <see cref="MeanSquaredError"/>, in the outcome's units.</summary>
    public double RootMeanSquaredError => Math.Sqrt(MeanSquaredError);

    /// <summary>The fit of <paramref name="predicted"/> to <paramref name="observed"/>, sample by sample.</summary>
    public static SquaredErrorFit Of(ReadOnlySpan<double> observed, ReadOnlySpan<double> predicted)
    {
        if (observed.Length != predicted.Length) throw new ArgumentException("Observed and predicted values must pair up one to one.");
        int n = observed.Length;
        double mean = 0;
        foreach (double y in observed) mean += y;
        mean /= n;
        double residual = 0, total = 0;
        for (int s = 0; s < n; s++)
        {
            residual += (observed[s] - predicted[s]) * (observed[s] - predicted[s]);
            total += (observed[s] - mean) * (observed[s] - mean);
        }
        return new SquaredErrorFit(n, residual, total);
    }
}
