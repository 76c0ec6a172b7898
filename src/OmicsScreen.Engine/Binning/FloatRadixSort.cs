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
/// comparisons. The sort is stable, unlike the comparison sort it replaces; the order of equal
/// values does not matter for binning, since equal values get the same code.
/// </remarks>
internal sealed class FloatRadixSort(int capacity)
{
    private const int Radix = 256;
    private readonly uint[] _keys = new uint[capacity];
    private readonly uint[] _otherKeys = new uint[capacity];
    private readonly int[] _otherSamples = new int[capacity];
    private readonly int[] _counts = new int[4 * Radix];

    /// <summary>Sorts values (no NaN) ascending; samples[i] moves with values[i].</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Sort(Span<float> values, Span<int> samples)
    {
        int count = values.Length;
        if (count < 2) return;
        var counts = _counts.AsSpan();
        counts.Clear();
        var keys = _keys.AsSpan(0, count);
        for (int i = 0; i < count; i++)
        {
            uint key = KeyOf(values[i]);
            keys[i] = key;
            counts[(int)(key & 0xFF)]++;
            counts[Radix + (int)((key >> 8) & 0xFF)]++;
            counts[2 * Radix + (int)((key >> 16) & 0xFF)]++;
            counts[3 * Radix + (int)(key >> 24)]++;
        }
        Span<uint> sourceKeys = keys, targetKeys = _otherKeys.AsSpan(0, count);
        Span<int> sourceSamples = samples, targetSamples = _otherSamples.AsSpan(0, count);
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
        }
        for (int i = 0; i < count; i++) values[i] = ValueOf(sourceKeys[i]);
        if (sourceSamples != samples) sourceSamples.CopyTo(samples);
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
