namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>A proportional-hazards fit of one marker.</summary>
/// <param name="Coefficient">log hazard ratio per unit of the marker.</param>
/// <param name="StandardError">From the observed information at the estimate.</param>
/// <param name="ScoreChiSquare">The score (log-rank type) test of no effect, U(0)^2 / I(0).</param>
/// <param name="HazardRatioPerSd">exp(coefficient x the marker's sample SD), with its Wald interval.</param>
/// <param name="Converged">False when the likelihood keeps rising without bound (a marker that separates events perfectly): the coefficient is then not an estimate, but the score test still is.</param>
public readonly record struct CoxFit(
    double Coefficient, double StandardError, double LogLikelihoodNull, double LogLikelihood,
    double ScoreChiSquare, double ScorePValue, double WaldPValue,
    double HazardRatioPerSd, ConfidenceInterval HazardRatioPerSdInterval,
    int Iterations, bool Converged);

/// <summary>
/// Cox (1972) proportional-hazards regression on one marker, with Efron's (1977) handling of tied
/// event times (the default of R's survival package), fitted by Newton-Raphson with step halving.
/// One covariate keeps every risk-set sum a scalar, so a fit is a few passes over the samples in
/// time order.
/// </summary>
public static class CoxSingleMarker
{
    private const int MaxIterations = 30;

    public static CoxFit Fit(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved, ReadOnlySpan<double> marker, double level = 0.95)
    {
        var (t, d, xs, sd) = Prepare(time, eventObserved, marker);
        var atZero = Evaluate(t, d, xs, 0.0);
        double scoreChi = ScoreChiSquare(atZero);
        double beta = 0;
        var current = atZero;
        int iteration = 0;
        bool converged = false;
        while (iteration < MaxIterations && current.Information > 0)
        {
            iteration++;
            double step = current.Score / current.Information;
            double candidate = beta + step;
            var next = Evaluate(t, d, xs, candidate);
            int halvings = 0;
            while (!(next.LogLikelihood >= current.LogLikelihood - 1e-12) && halvings < 20)
            {
                step /= 2;
                candidate = beta + step;
                next = Evaluate(t, d, xs, candidate);
                halvings++;
            }
            bool small = Math.Abs(next.LogLikelihood - current.LogLikelihood) <= 1e-10 * Math.Max(1.0, Math.Abs(current.LogLikelihood));
            beta = candidate;
            current = next;
            if (small) { converged = true; break; }
        }
        // A fit that only creeps up an unbounded likelihood has an ever-shrinking information.
        if (converged && !(current.Information > 1e-8 * Math.Max(1.0, atZero.Information))) converged = false;

        double se = current.Information > 0 ? 1.0 / Math.Sqrt(current.Information) : double.NaN;
        double z = NormalTail.TwoSidedCritical(level);
        var hrInterval = new ConfidenceInterval(Math.Exp((beta - z * se) * sd), Math.Exp((beta + z * se) * sd), level);
        return new CoxFit(
            beta, se, atZero.LogLikelihood, current.LogLikelihood,
            scoreChi, double.IsNaN(scoreChi) ? double.NaN : NormalTail.TwoSided(Math.Sqrt(scoreChi)),
            double.IsNaN(se) ? double.NaN : NormalTail.TwoSided(beta / se),
            Math.Exp(beta * sd), hrInterval, iteration, converged);
    }

    /// <summary>
    /// The score test of no effect alone (U(0)^2 / I(0), the log-rank type test of a continuous
    /// marker): the first step of <see cref="Fit"/>, without its Newton iterations, for callers that
    /// need only the p-value (the screen's rank test on thousands of features and decoys).
    /// </summary>
    public static (double ChiSquare, double PValue) ScoreTest(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved, ReadOnlySpan<double> marker)
    {
        var (t, d, xs, _) = Prepare(time, eventObserved, marker);
        double chi = ScoreChiSquare(Evaluate(t, d, xs, 0.0));
        return (chi, double.IsNaN(chi) ? double.NaN : NormalTail.TwoSided(Math.Sqrt(chi)));
    }

    private static double ScoreChiSquare(PartialLikelihood atZero) =>
        atZero.Information > 0 ? atZero.Score * atZero.Score / atZero.Information : double.NaN;

    /// <summary>The samples in ascending time with the marker centred, and the marker's sample SD.</summary>
    private static (double[] Time, bool[] Events, double[] Centred, double Sd) Prepare(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved,
        ReadOnlySpan<double> marker)
    {
        FollowUp.Check(time, eventObserved);
        if (marker.Length != time.Length) throw new ArgumentException("The marker needs one value per sample.");
        int n = marker.Length;
        double mean = 0;
        for (int i = 0; i < n; i++)
        {
            if (!double.IsFinite(marker[i])) throw new ArgumentException("The marker has a missing value; drop those samples first.");
            mean += marker[i];
        }
        mean /= n;
        // Centring changes neither the coefficient nor the tests, and keeps exp(beta x) in range.
        var x = new double[n];
        double sumSquares = 0;
        for (int i = 0; i < n; i++)
        {
            x[i] = marker[i] - mean;
            sumSquares += x[i] * x[i];
        }
        double sd = n > 1 ? Math.Sqrt(sumSquares / (n - 1)) : double.NaN;
        var order = FollowUp.OrderByTime(time);
        var t = new double[n];
        var d = new bool[n];
        var xs = new double[n];
        for (int p = 0; p < n; p++)
        {
            t[p] = time[order[p]];
            d[p] = eventObserved[order[p]];
            xs[p] = x[order[p]];
        }
        return (t, d, xs, sd);
    }

    private readonly record struct PartialLikelihood(double LogLikelihood, double Score, double Information);

    /// <summary>Efron's partial log-likelihood, its derivative and the observed information at beta; samples in ascending time.</summary>
    private static PartialLikelihood Evaluate(double[] t, bool[] d, double[] x, double beta)
    {
        int n = t.Length;
        double riskSum0 = 0, riskSum1 = 0, riskSum2 = 0;
        double logLikelihood = 0, score = 0, information = 0;
        int end = n;
        while (end > 0)
        {
            int start = end - 1;
            while (start > 0 && t[start - 1] == t[end - 1]) start--;
            double tied0 = 0, tied1 = 0, tied2 = 0, eventX = 0;
            int deaths = 0;
            for (int p = start; p < end; p++)
            {
                double w = Math.Exp(beta * x[p]);
                riskSum0 += w;
                riskSum1 += w * x[p];
                riskSum2 += w * x[p] * x[p];
                if (!d[p]) continue;
                deaths++;
                tied0 += w;
                tied1 += w * x[p];
                tied2 += w * x[p] * x[p];
                eventX += x[p];
            }
            if (deaths > 0)
            {
                logLikelihood += beta * eventX;
                score += eventX;
                for (int l = 0; l < deaths; l++)
                {
                    double share = (double)l / deaths;
                    double s0 = riskSum0 - share * tied0, s1 = riskSum1 - share * tied1, s2 = riskSum2 - share * tied2;
                    double m = s1 / s0;
                    logLikelihood -= Math.Log(s0);
                    score -= m;
                    information += s2 / s0 - m * m;
                }
            }
            end = start;
        }
        return new PartialLikelihood(logLikelihood, score, information);
    }
}
