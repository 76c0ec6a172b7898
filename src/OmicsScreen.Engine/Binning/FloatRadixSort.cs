using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace OmicsScreen.Engine.Binning;

/// <summary>
/// Sorts a feature's measured values with their sample numbers by a least-significant-digit
/// radix sort on an order-preserving 32-bit key, one byte per pass (Knuth, TAOCP vol. 3, 5.2.5).
/// One thread's buffers, sized once for a panel's sample count.
/// </summary>
/// <remarks>
/// The key flips every bit of a negative float and only the sign bit of a positive one, so
/// unsigned key order is the values' numeric order (-0 just below +0; NaN never reaches here,
/// it is a missing cell). The four byte counts are taken in one pass, and a pass whose byte is
/// the same for every value (the sign and exponent bytes of values within a few octaves) is
/// skipped, so a column usually costs two or three linear passes instead of n log n unpredictable
/// comparisons. The sort is stable; the order of equal values does not matter for binning, since
/// equal values get the same code.
/// <para>
/// The caller writes keys (<see cref="KeyOf"/>) and samples straight into <see cref="Keys"/> and
/// <see cref="Samples"/> and reads the result from <see cref="SortedKeys"/> and
/// <see cref="SortedSamples"/>, which are whichever of the two buffer pairs the last pass wrote:
/// no pass to convert values in, none to convert them back, none to copy the result home.
/// </para>
/// </remarks>
internal sealed class FloatRadixSort(int capacity)
{
    private const int Radix = 256;
    private readonly uint[] _keys = new uint[capacity];
    private readonly int[] _samples = new int[capacity];
    private readonly uint[] _otherKeys = new uint[capacity];
    private readonly int[] _otherSamples = new int[capacity];
    private readonly int[] _counts = new int[4 * Radix];
    private bool _sortedInOther;
    private int _count;

    /// <summary>Where the caller writes the keys to sort.</summary>
    public Span<uint> Keys => _keys;

    /// <summary>Where the caller writes the sample of each key.</summary>
    public Span<int> Samples => _samples;

    /// <summary>The keys of the last <see cref="Sort(int)"/>, ascending.</summary>
    public ReadOnlySpan<uint> SortedKeys => (_sortedInOther ? _otherKeys : _keys).AsSpan(0, _count);

    /// <summary>The sample of each of <see cref="SortedKeys"/>.</summary>
    public ReadOnlySpan<int> SortedSamples => (_sortedInOther ? _otherSamples : _samples).AsSpan(0, _count);

    /// <summary>Sorts the first <paramref name="count"/> entries of <see cref="Keys"/>, moving <see cref="Samples"/> with them.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Sort(int count)
    {
        _count = count;
        _sortedInOther = false;
        if (count < 2) return;
        var counts = _counts.AsSpan();
        counts.Clear();
        var keys = _keys.AsSpan(0, count);
        foreach (uint key in keys)
        {
            counts[(int)(key & 0xFF)]++;
            counts[Radix + (int)((key >> 8) & 0xFF)]++;
            counts[2 * Radix + (int)((key >> 16) & 0xFF)]++;
            counts[3 * Radix + (int)(key >> 24)]++;
        }
        Span<uint> sourceKeys = keys, targetKeys = _otherKeys.AsSpan(0, count);
        Span<int> sourceSamples = _samples.AsSpan(0, count), targetSamples = _otherSamples.AsSpan(0, count);
        for (int pass = 0; pass < 4; pass++)
        {
            int shift = 8 * pass;
            var digitCounts = counts.Slice(pass * Radix, Radix);
            if (digitCounts[(int)((sourceKeys[0] >> shift) & 0xFF)] == count) continue; // every value shares this byte
            // Counts become each digit's first position in the target.
            int position = 0;
            for (int digit = 0; digit < Radix; digit++)
            {
                int digitCount = digitCounts[digit];
                digitCounts[digit] = position;
                position += digitCount;
            }
            ref int offset0 = ref MemoryMarshal.GetReference(digitCounts);
            for (int i = 0; i < count; i++)
            {
                uint key = sourceKeys[i];
                int at = Unsafe.Add(ref offset0, (int)((key >> shift) & 0xFF))++;
                targetKeys[at] = key;
                targetSamples[at] = sourceSamples[i];
            }
            var keySwap = sourceKeys; sourceKeys = targetKeys; targetKeys = keySwap;
            var sampleSwap = sourceSamples; sourceSamples = targetSamples; targetSamples = sampleSwap;
            _sortedInOther = !_sortedInOther;
        }
    }

    /// <summary>Sorts values (no NaN) ascending; samples[i] moves with values[i]. For tests and callers holding floats.</summary>
    public void Sort(Span<float> values, Span<int> samples)
    {
        for (int i = 0; i < values.Length; i++)
        {
            _keys[i] = KeyOf(values[i]);
            _samples[i] = samples[i];
        }
        Sort(values.Length);
        var sortedKeys = SortedKeys;
        for (int i = 0; i < values.Length; i++) values[i] = ValueOf(sortedKeys[i]);
        SortedSamples.CopyTo(samples);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static uint KeyOf(float value)
    {
        uint bits = BitConverter.SingleToUInt32Bits(value);
        return (bits & 0x8000_0000u) != 0 ? ~bits : bits | 0x8000_0000u;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static float ValueOf(uint key) =>
        BitConverter.UInt32BitsToSingle((key & 0x8000_0000u) != 0 ? key & 0x7FFF_FFFFu : ~key);
}
