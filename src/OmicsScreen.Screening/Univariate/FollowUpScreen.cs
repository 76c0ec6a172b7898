using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Univariate;

/// <summary>One marker against censored follow-up.</summary>
/// <param name="Concordance">Harrell's C of the marker as a risk score (higher value, earlier event) with its interval.</param>
/// <param name="HazardRatioPerSd">Cox model hazard ratio per SD of the marker, with its Wald interval.</param>
/// <param name="PValue">Cox score test of no effect (the log-rank type test of a continuous marker).</param>
/// <param name="Direction">In words: "higher values, shorter survival", "higher values, longer survival", or "no clear effect" when the hazard-ratio interval spans 1.</param>
/// <param name="ModelConverged">False when the marker separates events perfectly and the hazard ratio runs off to infinity (the score test still holds).</param>
public sealed record FollowUpMarker(
    int Feature, string FeatureName, int Samples, int Events, ConcordanceEstimate Concordance,
    double HazardRatioPerSd, ConfidenceInterval HazardRatioInterval, double PValue, double QValue, string Direction,
    bool ModelConverged, double MissingPercent, double BelowDetectionPercent);

/// <summary>
/// Per-marker statistics of a time-to-event outcome: Harrell's C (Harrell et al. 1982) with its
/// infinitesimal-jackknife interval, a single-marker Cox model (Cox 1972; Efron ties) with the
/// hazard ratio per SD and its Wald interval, the score-test p-value, Benjamini-Hochberg q-values
/// across features, and the direction in words.
/// </summary>
/// <remarks>
/// Missing cells are left out. Below-detection cells count as tied lowest values for C, and enter
/// the Cox model at their limit divided by sqrt(2) (Hornung &amp; Reed 1990), or at half the smallest
/// measured value when no limit was given. Features run in parallel; results are stored by
/// feature index, so the table does not depend on the thread count.
/// </remarks>
public static class FollowUpScreen
{
    public static FollowUpMarker[] Compute(FeatureMatrix matrix, ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved,
        double level = 0.95, int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        FollowUp.Check(time, eventObserved);
        if (time.Length != matrix.SampleCount) throw new ArgumentException("The follow-up needs one time per sample.");
        var times = time.ToArray();
        var events = eventObserved.ToArray();
        var rows = new FollowUpMarker[matrix.FeatureCount];
        var parallel = WorkerThreads.Options(threadCount);
        Parallel.For(0, matrix.FeatureCount, parallel, () => (Rank: new double[times.Length], Model: new double[times.Length]),
            (feature, _, buffers) =>
            {
                var (missing, below) = MarkerValues.RankScale(matrix, feature, buffers.Rank);
                MarkerValues.ModelScale(matrix, feature, buffers.Model);
                rows[feature] = Describe(matrix.FeatureNames[feature], feature, times, events, buffers.Rank, buffers.Model,
                    100.0 * missing / times.Length, 100.0 * below / times.Length, level);
                return buffers;
            }, _ => { });
        var p = rows.Select(r => r.PValue).ToArray();
        var q = new double[p.Length];
        BenjaminiHochberg.Adjust(p, q);
        for (int f = 0; f < rows.Length; f++) rows[f] = rows[f] with { QValue = q[f] };
        return rows;
    }

    private static FollowUpMarker Describe(string name, int feature, double[] times, bool[] events, double[] rank, double[] model,
        double missingPercent, double belowPercent, double level)
    {
        var kept = new List<int>(times.Length);
        for (int s = 0; s < times.Length; s++)
            if (!double.IsNaN(rank[s]) && !double.IsNaN(model[s])) kept.Add(s);
        var t = kept.Select(s => times[s]).ToArray();
        var e = kept.Select(s => events[s]).ToArray();
        int eventCount = e.Count(v => v);
        var undefined = ConfidenceInterval.Undefined(level);
        if (kept.Count < 3 || eventCount == 0)
            return new FollowUpMarker(feature, name, kept.Count, eventCount, default, double.NaN, undefined, 1.0, double.NaN,
                "no clear effect", false, missingPercent, belowPercent);
        // -inf (below detection) ranks lowest; the concordance only uses ranks.
        var concordance = HarrellConcordance.Estimate(t, e, kept.Select(s => rank[s]).ToArray(), level);
        var cox = CoxSingleMarker.Fit(t, e, kept.Select(s => model[s]).ToArray(), level);
        double p = double.IsNaN(cox.ScorePValue) ? 1.0 : cox.ScorePValue;
        return new FollowUpMarker(feature, name, kept.Count, eventCount, concordance, cox.HazardRatioPerSd,
            cox.HazardRatioPerSdInterval, p, double.NaN, DirectionOf(cox.HazardRatioPerSdInterval, cox.Converged, concordance.Concordance),
            cox.Converged, missingPercent, belowPercent);
    }

    /// <summary>
    /// The direction a lab reads, claimed only when the hazard-ratio interval excludes 1; when the
    /// model did not converge (perfect separation) the concordance gives the side.
    /// </summary>
    public static string DirectionOf(ConfidenceInterval hazardRatio, bool converged, double concordance)
    {
        if (!converged) return concordance > 0.5 ? "higher values, shorter survival" : concordance < 0.5 ? "higher values, longer survival" : "no clear effect";
        return hazardRatio.Lower > 1 ? "higher values, shorter survival"
            : hazardRatio.Upper < 1 ? "higher values, longer survival"
            : "no clear effect";
    }
}
