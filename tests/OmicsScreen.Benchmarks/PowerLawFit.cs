using MathNet.Numerics;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// y = Scale * x^Exponent fitted by ordinary least squares on (log x, log y), with the R^2 of
/// that log-log line. The line is MathNet.Numerics' Fit.Line and its R^2 GoodnessOfFit.RSquared.
/// </summary>
public sealed record PowerLawFit(double Scale, double Exponent, double RSquared, int PointCount)
{
    /// <summary>Fits the points whose x and y are both positive and finite; NaN figures when fewer than two remain.</summary>
    public static PowerLawFit Of(IReadOnlyList<double> xs, IReadOnlyList<double> ys)
    {
        var logX = new List<double>();
        var logY = new List<double>();
        for (int i = 0; i < xs.Count; i++)
        {
            if (!(xs[i] > 0 && ys[i] > 0) || double.IsInfinity(xs[i]) || double.IsInfinity(ys[i])) continue;
            logX.Add(Math.Log(xs[i]));
            logY.Add(Math.Log(ys[i]));
        }
        if (logX.Count < 2) return new PowerLawFit(double.NaN, double.NaN, double.NaN, logX.Count);
        var (intercept, slope) = Fit.Line(logX.ToArray(), logY.ToArray());
        var modelled = new double[logX.Count];
        for (int i = 0; i < modelled.Length; i++) modelled[i] = intercept + slope * logX[i];
        // With two points the line is exact; R^2 is reported as 1 rather than left undefined.
        double rSquared = logX.Count == 2 ? 1.0 : GoodnessOfFit.RSquared(modelled, logY);
        return new PowerLawFit(Math.Exp(intercept), slope, rSquared, logX.Count);
    }

    public double At(double x) => Scale * Math.Pow(x, Exponent);
}
