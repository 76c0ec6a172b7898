using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Univariate;

/// <summary>One marker against a measured outcome.</summary>
/// <param name="Direction">In words: "rises with the outcome", "falls with the outcome", or "no clear trend" when the interval spans 0.</param>
public sealed record MeasuredOutcomeMarker(
    int Feature, string FeatureName, int Pairs, double Rho, ConfidenceInterval Interval, double PValue, double QValue,
    string Direction, double MissingPercent, double BelowDetectionPercent);

/// <summary>
/// Per-marker statistics of a measured (continuous) outcome: Spearman's rho with its t-test
/// p-value and Fisher-z interval (<see cref="SpearmanTest"/>), Benjamini-Hochberg q-values across
/// features, and the direction in words.
/// </summary>
/// <remarks>
/// Missing cells (and samples without an outcome value, NaN) are left out. Below-detection cells
/// enter as values tied with each other below every measured value, as in the class statistics:
/// the assay says they are lower than its limit. Features run in parallel and every result is
/// stored by feature index, so the table does not depend on the thread count.
/// </remarks>
public static class MeasuredOutcomeScreen
{
    public static MeasuredOutcomeMarker[] Compute(FeatureMatrix matrix, ReadOnlySpan<double> outcome, double level = 0.95,
        int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        if (outcome.Length != matrix.SampleCount) throw new ArgumentException("The outcome needs one value per sample.");
        var y = outcome.ToArray();
        var rows = new MeasuredOutcomeMarker[matrix.FeatureCount];
        var parallel = WorkerThreads.Options(threadCount);
        Parallel.For(0, matrix.FeatureCount, parallel, () => new double[matrix.SampleCount], (feature, _, x) =>
        {
            var (missing, below) = MarkerValues.RankScale(matrix, feature, x);
            var test = SpearmanTest.Test(x, y, level);
            rows[feature] = new MeasuredOutcomeMarker(feature, matrix.FeatureNames[feature], test.Pairs, test.Rho, test.Interval,
                double.IsNaN(test.PValue) ? 1.0 : test.PValue, double.NaN, DirectionOf(test.Interval),
                100.0 * missing / matrix.SampleCount, 100.0 * below / matrix.SampleCount);
            return x;
        }, _ => { });
        var p = rows.Select(r => r.PValue).ToArray();
        var q = new double[p.Length];
        BenjaminiHochberg.Adjust(p, q);
        for (int f = 0; f < rows.Length; f++) rows[f] = rows[f] with { QValue = q[f] };
        return rows;
    }

    /// <summary>The direction a lab reads; only claimed when the interval excludes no correlation.</summary>
    public static string DirectionOf(ConfidenceInterval interval) =>
        interval.Lower > 0 ? "rises with the outcome"
        : interval.Upper < 0 ? "falls with the outcome"
        : "no clear trend";
}

/// <summary>A marker's values as the univariate statistics of measured and time-to-event outcomes use them.</summary>
internal static class MarkerValues
{
    /// <summary>
    /// Fills x with the marker's values for rank statistics: measured values as they are, missing
    /// as NaN, below-detection cells as negative infinity (tied below every measured value).
    /// </summary>
    public static (int Missing, int Below) RankScale(FeatureMatrix matrix, int feature, double[] x)
    {
        var values = matrix.Column(feature);
        int missing = 0, below = 0;
        for (int s = 0; s < x.Length; s++)
        {
            var state = matrix.State(feature, s);
            if (state == CellState.BelowDetection) { x[s] = double.NegativeInfinity; below++; }
            else if (state == CellState.Missing || float.IsNaN(values[s])) { x[s] = double.NaN; missing++; }
            else x[s] = values[s];
        }
        return (missing, below);
    }

    /// <summary>
    /// Fills x with values for a model on the marker's scale: below-detection cells at their limit
    /// divided by sqrt(2) (Hornung &amp; Reed 1990, Appl. Occup. Environ. Hyg. 5:46), or at half the
    /// smallest measured value when the file gave no limit; missing as NaN.
    /// </summary>
    public static (int Missing, int Below) ModelScale(FeatureMatrix matrix, int feature, double[] x)
    {
        var values = matrix.Column(feature);
        double smallest = double.PositiveInfinity;
        for (int s = 0; s < x.Length; s++)
            if (matrix.State(feature, s) == CellState.Measured && !float.IsNaN(values[s])) smallest = Math.Min(smallest, values[s]);
        int missing = 0, below = 0;
        for (int s = 0; s < x.Length; s++)
        {
            var state = matrix.State(feature, s);
            if (state == CellState.BelowDetection)
            {
                below++;
                double limit = values[s];
                x[s] = !float.IsNaN(values[s]) ? limit / Math.Sqrt(2) : double.IsInfinity(smallest) ? double.NaN : smallest / 2;
            }
            else if (state == CellState.Missing || float.IsNaN(values[s])) { x[s] = double.NaN; missing++; }
            else x[s] = values[s];
        }
        return (missing, below);
    }
}
