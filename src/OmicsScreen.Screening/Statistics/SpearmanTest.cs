using MathNet.Numerics.Distributions;

namespace OmicsScreen.Screening.Statistics;

/// <summary>Spearman's rho of a marker against a measured outcome, with its p-value and interval.</summary>
public readonly record struct SpearmanResult(double Rho, int Pairs, double PValue, ConfidenceInterval Interval);

/// <summary>
/// Spearman's rank correlation as a test: rho over the complete pairs (midranks for ties), the
/// two-sided p-value of t = rho sqrt((n - 2) / (1 - rho^2)) on n - 2 degrees of freedom (the
/// approximation scipy's spearmanr uses), and a Fisher-z interval with the variance
/// (1 + rho^2 / 2) / (n - 3) that Bonett & Wright (2000) recommend for Spearman's rho.
/// </summary>
public static class SpearmanTest
{
    public static SpearmanResult Test(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double level = 0.95)
    {
        if (x.Length != y.Length) throw new ArgumentException("Both variables need one value per sample.");
        int pairs = 0;
        for (int i = 0; i < x.Length; i++)
            if (!double.IsNaN(x[i]) && !double.IsNaN(y[i])) pairs++;
        double rho = Correlation.Spearman(x, y);
        if (double.IsNaN(rho) || pairs < 3)
            return new SpearmanResult(rho, pairs, double.NaN, ConfidenceInterval.Undefined(level));
        double p;
        if (Math.Abs(rho) >= 1.0) p = 0.0;
        else
        {
            double t = rho * Math.Sqrt((pairs - 2) / (1.0 - rho * rho));
            p = 2.0 * StudentT.CDF(0, 1, pairs - 2, -Math.Abs(t));
        }
        var interval = ConfidenceInterval.Undefined(level);
        if (pairs > 3 && Math.Abs(rho) < 1.0)
        {
            double z = Math.Atanh(rho);
            double se = Math.Sqrt((1.0 + rho * rho / 2.0) / (pairs - 3));
            double critical = NormalTail.TwoSidedCritical(level);
            interval = new ConfidenceInterval(Math.Tanh(z - critical * se), Math.Tanh(z + critical * se), level);
        }
        return new SpearmanResult(rho, pairs, Math.Min(1.0, p), interval);
    }
}
