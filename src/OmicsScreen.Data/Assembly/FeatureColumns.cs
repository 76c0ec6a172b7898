using System.Runtime.CompilerServices;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Feature-major value and state arrays filled by a reader, in whatever order its file delivers
/// cells. Unlike <see cref="FeatureMatrixBuilder"/> it needs neither the sample ids nor the exact
/// counts in advance: a streaming reader sizes it from an upper bound on the row count, writes
/// each row into its own slot, and compacts the slots at the end.
/// </summary>
/// <remarks>
/// Rows may be stored from several threads at once as long as each thread writes its own sample
/// (or feature) slot: value and state writes then touch distinct elements, and a state array is
/// created at most once per feature by compare-and-swap. State arrays exist only for features with
/// an unmeasured cell, as in <see cref="FeatureMatrix"/>.
/// </remarks>
internal sealed class FeatureColumns
{
    // Plain arrays, not lists: Store runs once per cell and must inline to one array write.
    private readonly float[][] _values;
    private readonly CellState[]?[] _states;
    private readonly int _sampleCapacity;

    public FeatureColumns(int featureCount, int sampleCapacity)
    {
        _sampleCapacity = sampleCapacity;
        _values = new float[featureCount][];
        _states = new CellState[]?[featureCount];
        for (int f = 0; f < featureCount; f++) _values[f] = new float[sampleCapacity];
    }

    public int FeatureCount => _values.Length;
    public int SampleCapacity => _sampleCapacity;

    public Span<float> Values(int feature) => _values[feature];

    /// <summary>Stores one classified cell; returns false for a kind that is an input error.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool Store(int feature, int sample, CellKind kind, float value)
    {
        if (kind == CellKind.Measured)
        {
            _values[feature][sample] = value;
            return true;
        }
        return StoreUnmeasured(feature, sample, kind, value);
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

    /// <summary>
    /// The matrix of the given sample slots (in order) of the given feature slots; sample slots
    /// are copied one column at a time, feature slots are picked without copying.
    /// </summary>
    /// <param name="limits">Per-feature detection limits (a feature sheet's) applied to each column as it is gathered.</param>
    public FeatureMatrix ToMatrix(IReadOnlyList<string> featureNames, IReadOnlyList<string> sampleIds,
        int[]? featureSlots = null, int[]? sampleSlots = null, DetectionLimits? limits = null)
    {
        int featureCount = featureSlots?.Length ?? _values.Length;
        var values = new float[featureCount][];
        var states = new CellState[]?[featureCount];
        for (int f = 0; f < featureCount; f++)
        {
            int slot = featureSlots?[f] ?? f;
            values[f] = Pick(_values[slot], sampleSlots, sampleIds.Count);
            states[f] = _states[slot] is { } slotStates ? Pick(slotStates, sampleSlots, sampleIds.Count) : null;
            limits?.Apply(featureNames[f], values[f], ref states[f]);
            // Release the slot at once so that at most one extra column is alive while compacting.
            _values[slot] = [];
            _states[slot] = null;
        }
        return new FeatureMatrix(featureNames, sampleIds, values, states);
    }

    /// <summary>The array itself when the slots are 0..count-1 and fill it; otherwise a gathered copy.</summary>
    private static T[] Pick<T>(T[] column, int[]? slots, int count)
    {
        if (slots is null) return column.Length == count ? column : column[..count];
        bool identity = column.Length == count;
        for (int i = 0; identity && i < slots.Length; i++) identity = slots[i] == i;
        if (identity) return column;
        var picked = new T[slots.Length];
        for (int i = 0; i < slots.Length; i++) picked[i] = column[slots[i]];
        return picked;
    }

    private CellState[] StatesOf(int feature)
    {
        var states = Volatile.Read(ref _states[feature]);
        if (states is not null) return states;
        var created = new CellState[_sampleCapacity];
        return Interlocked.CompareExchange(ref _states[feature], created, null) ?? created;
    }
}
