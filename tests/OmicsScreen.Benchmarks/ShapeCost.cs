namespace OmicsScreen.Benchmarks;

/// <summary>
/// A cost that grows as a power of the panel's shape: Scale * rows^SampleExponent *
/// columns^FeatureExponent. The exponents come from the two one-at-a-time series (samples at
/// fixed features, features at fixed samples), which assumes the two effects multiply.
/// </summary>
public sealed record ShapeCost(double Scale, double SampleExponent, double FeatureExponent,
    PowerLawFit SampleFit, PowerLawFit FeatureFit)
{
    public double At(double rows, double columns) =>
        Scale * Math.Pow(rows, SampleExponent) * Math.Pow(columns, FeatureExponent);

    /// <summary>
    /// Fits each exponent on its own series, then the scale as the geometric mean over all points
    /// of cost / (rows^bn * columns^bp): the least-squares intercept on the log scale given the exponents.
    /// </summary>
    public static ShapeCost Fit(IReadOnlyList<ScalingPoint> samplesSeries, IReadOnlyList<ScalingPoint> featuresSeries,
        Func<ScalingPoint, double> cost)
    {
        var sampleFit = FitSeries(samplesSeries, p => p.SampleCount, cost);
        var featureFit = FitSeries(featuresSeries, p => p.FeatureCount, cost);
        double logSum = 0;
        int count = 0;
        foreach (var series in new[] { samplesSeries, featuresSeries })
            foreach (var point in series)
            {
                double value = cost(point);
                if (!(value > 0)) continue;
                logSum += Math.Log(value) - sampleFit.Exponent * Math.Log(point.SampleCount)
                    - featureFit.Exponent * Math.Log(point.FeatureCount);
                count++;
            }
        return new ShapeCost(Math.Exp(logSum / count), sampleFit.Exponent, featureFit.Exponent, sampleFit, featureFit);
    }

    /// <summary>
    /// For a cost the features series shows flat (out-of-bag permutation importance permutes only
    /// the features a tree splits on, so p hardly matters): exponent 0 over features, exponent and
    /// scale from the samples series alone. The features fit is kept for display, on the raw cost.
    /// </summary>
    public static ShapeCost FitFlatOverFeatures(IReadOnlyList<ScalingPoint> samplesSeries,
        IReadOnlyList<ScalingPoint> featuresSeries, Func<ScalingPoint, double> cost, Func<ScalingPoint, double> rawCost)
    {
        var sampleFit = FitSeries(samplesSeries, p => p.SampleCount, cost);
        var featureFit = FitSeries(featuresSeries, p => p.FeatureCount, rawCost);
        double logSum = 0;
        int count = 0;
        foreach (var point in samplesSeries)
        {
            double value = cost(point);
            if (!(value > 0)) continue;
            logSum += Math.Log(value) - sampleFit.Exponent * Math.Log(point.SampleCount);
            count++;
        }
        return new ShapeCost(Math.Exp(logSum / count), sampleFit.Exponent, 0, sampleFit, featureFit);
    }

    public static PowerLawFit FitSeries(IReadOnlyList<ScalingPoint> series, Func<ScalingPoint, double> variable,
        Func<ScalingPoint, double> value)
    {
        var xs = new double[series.Count];
        var ys = new double[series.Count];
        for (int i = 0; i < series.Count; i++)
        {
            xs[i] = variable(series[i]);
            ys[i] = value(series[i]);
        }
        return PowerLawFit.Of(xs, ys);
    }
}
