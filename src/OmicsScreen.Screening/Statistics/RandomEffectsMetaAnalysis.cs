using MathNet.Numerics;

namespace OmicsScreen.Screening.Statistics;

/// <summary>Random-effects meta-analysis by the method of moments of DerSimonian &amp; Laird (1986).</summary>
/// <remarks>
/// Given study estimates y_i with within-study variances v_i (w_i = 1/v_i):
/// Q = sum w_i (y_i - y_FE)^2 (Cochran 1954); tau^2 = max(0, (Q - (k - 1)) / (sum w - sum w^2 / sum w))
/// (DerSimonian &amp; Laird 1986, Controlled Clinical Trials 7:177); I^2 = max(0, (Q - df)/Q) and
/// H^2 = Q / df (Higgins &amp; Thompson 2002, Statistics in Medicine 21:1539). The random-effects
/// interval uses the normal quantile, as in the original method (no Hartung-Knapp adjustment).
/// </remarks>
public static class RandomEffectsMetaAnalysis
{
    public static MetaAnalysisResult DerSimonianLaird(ReadOnlySpan<double> estimates, ReadOnlySpan<double> variances,
        double level = 0.95)
    {
        int studyCount = estimates.Length;
        if (variances.Length != studyCount) throw new ArgumentException("One variance is needed per estimate.", nameof(variances));
        if (studyCount == 0) throw new ArgumentException("At least one study is needed.", nameof(estimates));
        double weightSum = 0, weightSquareSum = 0, weightedSum = 0;
        for (int i = 0; i < studyCount; i++)
        {
            if (!(variances[i] > 0) || double.IsNaN(estimates[i]) || double.IsInfinity(variances[i]))
                throw new ArgumentException($"Study {i} needs a finite estimate and a positive, finite variance.");
            double weight = 1 / variances[i];
            weightSum += weight;
            weightSquareSum += weight * weight;
            weightedSum += weight * estimates[i];
        }
        double fixedEstimate = weightedSum / weightSum;
        double q = 0;
        for (int i = 0; i < studyCount; i++)
        {
            double d = estimates[i] - fixedEstimate;
            q += d * d / variances[i];
        }
        int df = studyCount - 1;
        double scaling = weightSum - weightSquareSum / weightSum;
        double tau2 = df > 0 && scaling > 0 ? Math.Max(0, (q - df) / scaling) : 0;
        double i2 = q > 0 ? Math.Max(0, (q - df) / q) : df > 0 ? 0 : double.NaN;
        double h2 = df > 0 ? q / df : double.NaN;
        double qPValue = df > 0 ? SpecialFunctions.GammaUpperRegularized(0.5 * df, 0.5 * q) : double.NaN;

        double randomWeightSum = 0, randomWeightedSum = 0;
        for (int i = 0; i < studyCount; i++)
        {
            double weight = 1 / (variances[i] + tau2);
            randomWeightSum += weight;
            randomWeightedSum += weight * estimates[i];
        }
        double randomEstimate = randomWeightedSum / randomWeightSum;
        double randomError = 1 / Math.Sqrt(randomWeightSum);
        double halfWidth = NormalTail.TwoSidedCritical(level) * randomError;
        return new MetaAnalysisResult(studyCount, fixedEstimate, 1 / Math.Sqrt(weightSum), q, df, qPValue, tau2, i2, h2,
            randomEstimate, randomError, new ConfidenceInterval(randomEstimate - halfWidth, randomEstimate + halfWidth, level));
    }
}
