namespace OmicsScreen.Engine.Panels;

/// <summary>
/// Measurements of samples x features in float32, stored feature-major: each feature is one
/// contiguous array of <see cref="SampleCount"/> values, so binning and split search scan a
/// feature without striding.
/// </summary>
/// <remarks>
/// A cell whose state is not <see cref="CellState.Measured"/> holds NaN, or for a censored cell
/// the detection limit when the file gave one. State arrays exist only for features that have
/// at least one such cell, which keeps a complete panel at exactly 4 bytes per cell.
/// </remarks>
public sealed class FeatureMatrix
{
    private readonly float[][] _columns;
    private readonly CellState[]?[] _states;

    public FeatureMatrix(IReadOnlyList<string> featureNames, IReadOnlyList<string> sampleIds,
        float[][] columns, CellState[]?[] states)
    {
        ArgumentNullException.ThrowIfNull(featureNames);
        ArgumentNullException.ThrowIfNull(sampleIds);
        ArgumentNullException.ThrowIfNull(columns);
        ArgumentNullException.ThrowIfNull(states);
        if (columns.Length != featureNames.Count || states.Length != featureNames.Count)
            throw new ArgumentException("One column and one state slot are needed per feature name.");
        for (int f = 0; f < columns.Length; f++)
        {
            if (columns[f] is null || columns[f].Length != sampleIds.Count)
                throw new ArgumentException($"Column {f} does not have one value per sample.");
            if (states[f] is { } s && s.Length != sampleIds.Count)
                throw new ArgumentException($"State column {f} does not have one entry per sample.");
        }
        FeatureNames = featureNames.ToArray();
        SampleIds = sampleIds.ToArray();
        _columns = columns;
        _states = states;
    }

    public int SampleCount => SampleIds.Count;
    public int FeatureCount => FeatureNames.Count;
    public IReadOnlyList<string> FeatureNames { get; }
    public IReadOnlyList<string> SampleIds { get; }

    /// <summary>The values of one feature, one per sample, in sample order.</summary>
    public ReadOnlySpan<float> Column(int feature) => _columns[feature];

    /// <summary>The cell states of one feature, or an empty span when every cell is measured.</summary>
    public ReadOnlySpan<CellState> States(int feature) => _states[feature];

    public bool HasUnmeasuredCells(int feature) => _states[feature] is not null;

    public CellState State(int feature, int sample) =>
        _states[feature] is { } s ? s[sample] : CellState.Measured;

    /// <summary>The value of a measured cell; NaN for missing, the limit (or NaN) for below detection.</summary>
    public float Value(int feature, int sample) => _columns[feature][sample];

    /// <summary>A new matrix holding the given samples, in the given order (repeats allowed).</summary>
    public FeatureMatrix SelectSamples(ReadOnlySpan<int> samples)
    {
        var ids = new string[samples.Length];
        for (int i = 0; i < samples.Length; i++) ids[i] = SampleIds[samples[i]];
        var columns = new float[FeatureCount][];
        var states = new CellState[]?[FeatureCount];
        for (int f = 0; f < FeatureCount; f++)
        {
            var source = _columns[f];
            var column = new float[samples.Length];
            for (int i = 0; i < samples.Length; i++) column[i] = source[samples[i]];
            columns[f] = column;
            if (_states[f] is { } sourceStates)
            {
                var state = new CellState[samples.Length];
                bool any = false;
                for (int i = 0; i < samples.Length; i++)
                {
                    state[i] = sourceStates[samples[i]];
                    any |= state[i] != CellState.Measured;
                }
                states[f] = any ? state : null;
            }
        }
        return new FeatureMatrix(FeatureNames, ids, columns, states);
    }

    /// <summary>A new matrix holding the given features, in the given order; columns are shared, not copied.</summary>
    public FeatureMatrix SelectFeatures(ReadOnlySpan<int> features)
    {
        var names = new string[features.Length];
        var columns = new float[features.Length][];
        var states = new CellState[]?[features.Length];
        for (int i = 0; i < features.Length; i++)
        {
            names[i] = FeatureNames[features[i]];
            columns[i] = _columns[features[i]];
            states[i] = _states[features[i]];
        }
        return new FeatureMatrix(names, SampleIds, columns, states);
    }
}
