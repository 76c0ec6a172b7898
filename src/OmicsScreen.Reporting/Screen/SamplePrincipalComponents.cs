using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// Every sample's scores on the first two principal components of the standardised panel, for the
/// report's sample map. Deterministic: a fixed start vector and a fixed number of power iterations.
/// </summary>
/// <remarks>
/// Each feature is centred and scaled to unit variance over its measured cells; a missing cell
/// gets the feature's mean (score 0) and a below-detection cell the smallest measured value, its
/// nearest known bound. Components are found by power iteration on XᵀX through two matrix-vector
/// products (X v, then Xᵀ(X v)), so XᵀX is never formed; the second is deflated against the first
/// (Golub &amp; Van Loan 2013, section 8.2, common practice). Wide panels use the
/// <see cref="FeatureLimit"/> features of largest variance on the original scale, a usual screen
/// for a map of samples; the figure caption says so.
/// </remarks>
internal sealed class SamplePrincipalComponents
{
    public const int FeatureLimit = 2000;
    private const int Iterations = 200;

    private SamplePrincipalComponents(double[] first, double[] second, double firstShare, double secondShare, int featuresUsed)
    {
        First = first;
        Second = second;
        FirstShare = firstShare;
        SecondShare = secondShare;
        FeaturesUsed = featuresUsed;
    }

    /// <summary>Scores of each sample on the first component.</summary>
    public double[] First { get; }

    public double[] Second { get; }

    /// <summary>Shares of the total variance the components explain.</summary>
    public double FirstShare { get; }

    public double SecondShare { get; }

    public int FeaturesUsed { get; }

    public static SamplePrincipalComponents? Of(FeatureMatrix matrix)
    {
        int samples = matrix.SampleCount;
        if (samples < 3 || matrix.FeatureCount < 2) return null;
        var columns = StandardisedColumns(matrix);
        if (columns.Count < 2) return null;
        double total = 0;
        foreach (var column in columns)
            foreach (double value in column) total += value * value;
        var first = Component(columns, samples, null);
        var second = Component(columns, samples, first.Direction);
        return new SamplePrincipalComponents(first.Scores, second.Scores, first.Variance / total, second.Variance / total, columns.Count);
    }

    /// <summary>The leading component of the columns (orthogonal to <paramref name="previous"/> when given): its direction, scores and variance.</summary>
    private static (double[] Direction, double[] Scores, double Variance) Component(List<double[]> columns, int samples, double[]? previous)
    {
        int features = columns.Count;
        var direction = new double[features];
        for (int f = 0; f < features; f++) direction[f] = 1.0 + (f % 7) * 0.1; // fixed, not orthogonal to any likely component
        var scores = new double[samples];
        for (int iteration = 0; iteration < Iterations; iteration++)
        {
            if (previous is not null) Deflate(direction, previous);
            Normalise(direction);
            Project(columns, direction, scores);
            for (int f = 0; f < features; f++)
            {
                double sum = 0;
                var column = columns[f];
                for (int s = 0; s < samples; s++) sum += column[s] * scores[s];
                direction[f] = sum;
            }
        }
        if (previous is not null) Deflate(direction, previous);
        Normalise(direction);
        Project(columns, direction, scores);
        // A component's sign is arbitrary; fix it so the largest score is positive, for the same picture every time.
        int largest = 0;
        for (int s = 1; s < samples; s++) if (Math.Abs(scores[s]) > Math.Abs(scores[largest])) largest = s;
        if (scores[largest] < 0)
        {
            for (int s = 0; s < samples; s++) scores[s] = -scores[s];
            for (int f = 0; f < features; f++) direction[f] = -direction[f];
        }
        double variance = 0;
        foreach (double score in scores) variance += score * score;
        return (direction, scores, variance);
    }

    private static void Project(List<double[]> columns, double[] direction, double[] scores)
    {
        Array.Clear(scores);
        for (int f = 0; f < columns.Count; f++)
        {
            double weight = direction[f];
            var column = columns[f];
            for (int s = 0; s < scores.Length; s++) scores[s] += weight * column[s];
        }
    }

    private static void Deflate(double[] vector, double[] against)
    {
        double dot = 0;
        for (int i = 0; i < vector.Length; i++) dot += vector[i] * against[i];
        for (int i = 0; i < vector.Length; i++) vector[i] -= dot * against[i];
    }

    private static void Normalise(double[] vector)
    {
        double norm = 0;
        foreach (double value in vector) norm += value * value;
        norm = Math.Sqrt(norm);
        if (norm == 0) return;
        for (int i = 0; i < vector.Length; i++) vector[i] /= norm;
    }

    /// <summary>The standardised columns of the features kept (largest variance first when the panel is wide); constant features are left out.</summary>
    private static List<double[]> StandardisedColumns(FeatureMatrix matrix)
    {
        int samples = matrix.SampleCount;
        var candidates = new List<(int Feature, double Mean, double Sd, double Floor)>();
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            var values = matrix.Column(f);
            var states = matrix.HasUnmeasuredCells(f) ? matrix.States(f) : default;
            double sum = 0, squares = 0, floor = double.PositiveInfinity;
            int measured = 0;
            for (int s = 0; s < samples; s++)
            {
                if (!states.IsEmpty && states[s] != CellState.Measured) continue;
                double value = values[s];
                sum += value;
                squares += value * value;
                floor = Math.Min(floor, value);
                measured++;
            }
            if (measured < 2) continue;
            double mean = sum / measured;
            double variance = Math.Max(0, squares / measured - mean * mean);
            if (!(variance > 0)) continue;
            candidates.Add((f, mean, Math.Sqrt(variance), floor));
        }
        if (candidates.Count > FeatureLimit)
        {
            candidates.Sort((a, b) => b.Sd.CompareTo(a.Sd) != 0 ? b.Sd.CompareTo(a.Sd) : a.Feature.CompareTo(b.Feature));
            candidates.RemoveRange(FeatureLimit, candidates.Count - FeatureLimit);
            candidates.Sort((a, b) => a.Feature.CompareTo(b.Feature));
        }
        var columns = new List<double[]>(candidates.Count);
        foreach (var (feature, mean, sd, floor) in candidates)
        {
            var values = matrix.Column(feature);
            var states = matrix.HasUnmeasuredCells(feature) ? matrix.States(feature) : default;
            var column = new double[samples];
            for (int s = 0; s < samples; s++)
            {
                var state = states.IsEmpty ? CellState.Measured : states[s];
                double value = state switch
                {
                    CellState.Measured => values[s],
                    CellState.BelowDetection => floor,
                    _ => mean,
                };
                column[s] = (value - mean) / sd;
            }
            columns.Add(column);
        }
        return columns;
    }
}
