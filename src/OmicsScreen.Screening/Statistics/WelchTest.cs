using MathNet.Numerics;

namespace OmicsScreen.Screening.Statistics;

/// <summary>Welch's t-test (Welch 1947) with Welch-Satterthwaite degrees of freedom.</summary>
/// <remarks>
/// t = (m1 - m0) / sqrt(v1/n1 + v0/n0);
/// df = (v1/n1 + v0/n0)^2 / ((v1/n1)^2/(n1 - 1) + (v0/n0)^2/(n0 - 1)) (Satterthwaite 1946).
/// The two-sided p-value is the regularized incomplete beta I_x(df/2, 1/2) at x = df / (df + t^2),
/// which equals 2 P(T_df &gt; |t|) without the cancellation of 1 - CDF.
/// Each sample needs two values; when both variances are zero the test is undefined and every
/// field except the mean difference is NaN. NaN values are rejected.
/// </remarks>
public static class WelchTest
{
    public static WelchTestResult Test(ReadOnlySpan<double> first, ReadOnlySpan<double> second)
    {
        if (first.Length < 2 || second.Length < 2)
            return new WelchTestResult(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        var (mean1, variance1) = MeanAndVariance(first);
        var (mean0, variance0) = MeanAndVariance(second);
        double n1 = first.Length, n0 = second.Length;
        double share1 = variance1 / n1, share0 = variance0 / n0;
        double squaredError = share1 + share0;
        double difference = mean1 - mean0;
        if (!(squaredError > 0)) return new WelchTestResult(double.NaN, double.NaN, double.NaN, difference, 0);
        double standardError = Math.Sqrt(squaredError);
        double t = difference / standardError;
        double df = squaredError * squaredError / (share1 * share1 / (n1 - 1) + share0 * share0 / (n0 - 1));
        return new WelchTestResult(t, df, StudentTTwoSided(t, df), difference, standardError);
    }

    /// <summary>P(|T| &gt;= |t|) for Student's t with <paramref name="degreesOfFreedom"/>.</summary>
    public static double StudentTTwoSided(double t, double degreesOfFreedom)
    {
        if (double.IsNaN(t) || !(degreesOfFreedom > 0)) return double.NaN;
        if (double.IsInfinity(t)) return 0;
        double x = degreesOfFreedom / (degreesOfFreedom + t * t);
        return Math.Min(1.0, SpecialFunctions.BetaRegularized(0.5 * degreesOfFreedom, 0.5, x));
    }

    /// <summary>Mean and sample variance (divisor n - 1), two-pass for accuracy.</summary>
    internal static (double Mean, double Variance) MeanAndVariance(ReadOnlySpan<double> values)
    {
        double sum = 0;
        foreach (double v in values)
        {
            if (double.IsNaN(v)) throw new ArgumentException("NaN values are not allowed.", nameof(values));
            sum += v;
        }
        double mean = sum / values.Length;
        double squares = 0, residual = 0;
        foreach (double v in values)
        {
            double d = v - mean;
            squares += d * d;
            residual += d;
        }
        // The residual sum corrects the rounding of the mean (Chan, Golub & LeVeque 1983, "corrected two-pass").
        double variance = (squares - residual * residual / values.Length) / (values.Length - 1);
        return (mean, variance);
    }
}
