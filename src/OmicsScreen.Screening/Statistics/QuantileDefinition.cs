namespace OmicsScreen.Screening.Statistics;

/// <summary>Sample quantile definitions, numbered as in Hyndman &amp; Fan (1996, The American Statistician 50:361).</summary>
/// <remarks>
/// For the median (probability 1/2) types 2, 5, 6, 7, 8 and 9 all give the usual sample median: the
/// middle value, or the mean of the two middle values for an even count.
/// </remarks>
public enum QuantileDefinition
{
    /// <summary>Type 1, the inverse of the empirical CDF: the smallest x with F(x) &gt;= p; always an observed value.</summary>
    InverseEmpiricalCdf = 1,
    /// <summary>Type 6, linear interpolation at position p (n + 1) (Minitab, SPSS).</summary>
    Weibull = 6,
    /// <summary>Type 7, linear interpolation at position 1 + p (n - 1) (R, numpy and Excel default).</summary>
    Linear = 7,
}
