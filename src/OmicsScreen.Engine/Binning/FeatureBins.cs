using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Binning;

/// <summary>
/// How one feature's values map to byte codes: value bins 0..ValueBinCount-1 in increasing
/// order, then one code for missing cells and one for below-detection cells.
/// </summary>
/// <remarks>
/// Bin b holds the measured values v with UpperBound(b-1) &lt; v &lt;= UpperBound(b); the last
/// bound is +infinity. Each bound lies between the largest value of its bin and the smallest of
/// the next (their midpoint when float allows), so "code &lt;= b" and "value &lt;= UpperBound(b)"
/// agree on every training value, and a split's real threshold is simply UpperBound(b).
/// </remarks>
public sealed class FeatureBins
{
    // The bounds are _store[_start.._start + _count); binning puts many features' bounds in one
    // store so that a wide panel does not cost one small array per feature.
    private readonly float[] _store;
    private readonly int _start;
    private readonly int _count;

    public FeatureBins(float[] upperBounds, bool isExact)
    {
        ArgumentNullException.ThrowIfNull(upperBounds);
        if (upperBounds.Length is < 1 or > BinMapper.MaxValueBins)
            throw new ArgumentException($"A feature needs 1 to {BinMapper.MaxValueBins} value bins.");
        if (!float.IsPositiveInfinity(upperBounds[^1]))
            throw new ArgumentException("The last upper bound must be +infinity.");
        _store = upperBounds;
        _count = upperBounds.Length;
        IsExact = isExact;
    }

    /// <summary>Bounds already checked by the binning that wrote them, read in place from a shared store.</summary>
    internal FeatureBins(float[] store, int start, int count, bool isExact)
    {
        _store = store;
        _start = start;
        _count = count;
        IsExact = isExact;
    }

    public int ValueBinCount => _count;

    /// <summary>Every code the feature can take: the value bins plus missing and below detection.</summary>
    public int CodeCount => _count + BinMapper.ReservedCodes;

    public byte MissingCode => (byte)_count;

    public byte BelowDetectionCode => (byte)(_count + 1);

    /// <summary>True when every distinct measured value has its own bin, so split search is exact.</summary>
    public bool IsExact { get; }

    public ReadOnlySpan<float> UpperBounds => new(_store, _start, _count);

    public float UpperBound(int bin) => UpperBounds[bin];

    /// <summary>The code of a raw cell; NaN measured values count as missing.</summary>
    public byte CodeOf(float value, CellState state)
    {
        if (state == CellState.BelowDetection) return BelowDetectionCode;
        if (state == CellState.Missing || float.IsNaN(value)) return MissingCode;
        return (byte)ValueBinOf(value);
    }

    /// <summary>The first bin whose upper bound is at least the value (lower-bound binary search).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public int ValueBinOf(float value)
    {
        var bounds = UpperBounds;
        int low = 0, high = bounds.Length - 1;
        // Invariant: the answer lies in [low, high]; bounds[high] is +infinity so one always exists.
        while (low < high)
        {
            int middle = (low + high) >>> 1;
            if (value <= bounds[middle]) high = middle;
            else low = middle + 1;
        }
        return low;
    }
}
