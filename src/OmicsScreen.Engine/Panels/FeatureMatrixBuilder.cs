namespace OmicsScreen.Engine.Panels;

/// <summary>
/// Fills a <see cref="FeatureMatrix"/> cell by cell, in any order. Readers use it so that both
/// orientations of a file end in the same feature-major layout.
/// </summary>
public sealed class FeatureMatrixBuilder
{
    private readonly float[][] _columns;
    private readonly CellState[]?[] _states;
    private readonly string[] _featureNames;
    private readonly string[] _sampleIds;

    public FeatureMatrixBuilder(IReadOnlyList<string> featureNames, IReadOnlyList<string> sampleIds)
    {
        _featureNames = featureNames.ToArray();
        _sampleIds = sampleIds.ToArray();
        _columns = new float[_featureNames.Length][];
        for (int f = 0; f < _columns.Length; f++) _columns[f] = new float[_sampleIds.Length];
        _states = new CellState[]?[_featureNames.Length];
    }

    public int SampleCount => _sampleIds.Length;
    public int FeatureCount => _featureNames.Length;

    /// <summary>Direct access to one feature's values, for readers that fill a whole column at once.</summary>
    public Span<float> Column(int feature) => _columns[feature];

    public void SetMeasured(int feature, int sample, float value) => _columns[feature][sample] = value;

    public void SetMissing(int feature, int sample)
    {
        _columns[feature][sample] = float.NaN;
        StatesOf(feature)[sample] = CellState.Missing;
    }

    /// <summary>Marks a censored cell; pass NaN when the file gave no limit.</summary>
    public void SetBelowDetection(int feature, int sample, float limit)
    {
        _columns[feature][sample] = limit;
        StatesOf(feature)[sample] = CellState.BelowDetection;
    }

    private CellState[] StatesOf(int feature) => _states[feature] ??= new CellState[_sampleIds.Length];

    public FeatureMatrix Build() => new(_featureNames, _sampleIds, _columns, _states);
}
