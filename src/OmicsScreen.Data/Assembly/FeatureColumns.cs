using System.Runtime.CompilerServices;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Feature-major value and state arrays filled by a reader, in whatever order its file delivers
/// cells. Unlike <see cref="FeatureMatrixBuilder"/> it does not need the sample ids in advance:
/// a streaming reader sizes it from an upper bound on the row count and trims it at the end.
/// </summary>
/// <remarks>State arrays are created only for features with an unmeasured cell, as in <see cref="FeatureMatrix"/>.</remarks>
internal sealed class FeatureColumns
{
    // Plain arrays, not lists: Store runs once per cell and must inline to two array writes.
    private float[][] _values;
    private CellState[]?[] _states;
    private int _featureCount;
    private int _sampleCapacity;

    public FeatureColumns(int featureCount, int sampleCapacity)
    {
        _sampleCapacity = sampleCapacity;
        _values = new float[Math.Max(featureCount, 4)][];
        _states = new CellState[]?[_values.Length];
        for (int f = 0; f < featureCount; f++) AppendFeature();
    }

    public int FeatureCount => _featureCount;
    public int SampleCapacity => _sampleCapacity;

    /// <summary>Adds one feature column of the current capacity and returns its index.</summary>
    public int AppendFeature()
    {
        if (_featureCount == _values.Length)
        {
            Array.Resize(ref _values, _values.Length * 2);
            Array.Resize(ref _states, _values.Length);
        }
        _values[_featureCount] = new float[_sampleCapacity];
        return _featureCount++;
    }

    public Span<float> Values(int feature) => _values[feature];

    /// <summary>Stores one classified cell; returns false for a kind that is an input error.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool Store(int feature, int sample, CellKind kind, float value)
    {
        switch (kind)
        {
            case CellKind.Measured:
                _values[feature][sample] = value;
                return true;
            default:
                return StoreUnmeasured(feature, sample, kind, value);
        }
    }

    private bool StoreUnmeasured(int feature, int sample, CellKind kind, float value)
    {
        switch (kind)
        {
            case CellKind.Missing:
                _values[feature][sample] = float.NaN;
                StatesOf(feature)[sample] = CellState.Missing;
                return true;
            case CellKind.BelowDetection:
                _values[feature][sample] = value;
                StatesOf(feature)[sample] = CellState.BelowDetection;
                return true;
            default:
                return false;
        }
    }

    /// <summary>Copies a whole column's states, as read by a columnar reader, when any cell is unmeasured.</summary>
    public void SetStates(int feature, ReadOnlySpan<CellState> states)
    {
        if (states.ContainsAnyExcept(CellState.Measured)) states.CopyTo(StatesOf(feature));
    }

    /// <summary>Doubles the capacity of every column; for the rare file whose row bound was too low.</summary>
    public void Grow()
    {
        int capacity = Math.Max(16, _sampleCapacity * 2);
        Resize(capacity);
    }

    /// <summary>Cuts every column to the samples actually read; one column is copied at a time.</summary>
    public void Trim(int sampleCount)
    {
        if (sampleCount != _sampleCapacity) Resize(sampleCount);
    }

    public FeatureMatrix ToMatrix(IReadOnlyList<string> featureNames, IReadOnlyList<string> sampleIds) =>
        new(featureNames, sampleIds, _values[.._featureCount], _states[.._featureCount]);

    private void Resize(int capacity)
    {
        for (int f = 0; f < _featureCount; f++)
        {
            var values = _values[f];
            Array.Resize(ref values, capacity);
            _values[f] = values;
            if (_states[f] is { } states)
            {
                Array.Resize(ref states, capacity);
                _states[f] = states;
            }
        }
        _sampleCapacity = capacity;
    }

    private CellState[] StatesOf(int feature)
    {
        var states = _states[feature];
        if (states is null)
        {
            states = new CellState[_sampleCapacity];
            _states[feature] = states;
        }
        return states;
    }
}
