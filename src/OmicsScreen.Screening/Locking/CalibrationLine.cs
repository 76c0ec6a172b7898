using MathNet.Numerics.Distributions;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Locking;

/// <summary>
/// The calibration line of a measured prediction: observed regressed on predicted by ordinary
/// least squares, observed = intercept + slope · predicted. A slope of 1 and an intercept of 0 mean
/// predictions on the right scale; a slope below 1 means predictions too spread out (overfitting
/// in discovery), above 1 too timid (Cox 1958; Van Calster et al. 2016 on calibration levels).
/// </summary>
/// <param name="Slope">Least-squares slope.</param>
/// <param name="SlopeInterval">Its confidence interval from Student's t with n - 2 degrees of freedom.</param>
/// <param name="Intercept">Least-squares intercept, in the outcome's units.</param>
/// <param name="InterceptInterval">Its confidence interval from Student's t with n - 2 degrees of freedom.</param>
/// <param name="ResidualStandardError">sqrt(residual sum of squares / (n - 2)).</param>
public sealed record CalibrationLine(
    double Slope,
    ConfidenceInterval SlopeInterval,
    double Intercept,
    ConfidenceInterval InterceptInterval,
    double ResidualStandardError,
    int SampleCount)
{
    /// <summary>
    /// Fits the line; the slope and intercept are NaN when the predictions do not vary, and the
    /// intervals are undefined with fewer than three samples (no residual degrees of freedom).
    /// </summary>
    public static CalibrationLine Fit(ReadOnlySpan<double> predicted, ReadOnlySpan<double> observed, double level = 0.95)
    {
        if (predicted.Length != observed.Length) throw new ArgumentException("One observed value is needed per prediction.");
        int n = predicted.Length;
        double meanX = 0, meanY = 0;
        for (int i = 0; i < n; i++)
        {
            meanX += predicted[i];
            meanY += observed[i];
        }
        meanX /= n;
        meanY /= n;
        // Centred sums, the numerically stable form of the normal equations.
        double sxx = 0, sxy = 0;
        for (int i = 0; i < n; i++)
        {
            double dx = predicted[i] - meanX;
            sxx += dx * dx;
            sxy += dx * (observed[i] - meanY);
        }
        if (n < 2 || !(sxx > 0))
            return new CalibrationLine(double.NaN, ConfidenceInterval.Undefined(level), double.NaN, ConfidenceInterval.Undefined(level), double.NaN, n);
        double slope = sxy / sxx, intercept = meanY - slope * meanX;
        if (n < 3)
            return new CalibrationLine(slope, ConfidenceInterval.Undefined(level), intercept, ConfidenceInterval.Undefined(level), double.NaN, n);
        double residualSum = 0;
        for (int i = 0; i < n; i++)
        {
            double residual = observed[i] - intercept - slope * predicted[i];
            residualSum += residual * residual;
        }
        int degrees = n - 2;
        double sigma = Math.Sqrt(residualSum / degrees);
        // Standard errors of simple linear regression: se(b) = s / sqrt(Sxx), se(a) = s sqrt(1/n + x̄² / Sxx).
        double slopeError = sigma / Math.Sqrt(sxx);
        double interceptError = sigma * Math.Sqrt(1.0 / n + meanX * meanX / sxx);
        double t = StudentT.InvCDF(0, 1, degrees, 0.5 + level / 2);
        return new CalibrationLine(slope, new ConfidenceInterval(slope - t * slopeError, slope + t * slopeError, level),
            intercept, new ConfidenceInterval(intercept - t * interceptError, intercept + t * interceptError, level), sigma, n);
    }
}
