using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The two-class histogram of a node for integer weights (bootstrap counts): one 64-bit word per
/// code holding the class-0 weight, the class-1 weight and the row count in three 21-bit fields.
/// </summary>
/// <remarks>
/// Each row carries a precomputed increment (its weight shifted into its class's field, plus one
/// in the row field), so counting a row is one integer add to one word, against two double adds
/// at a stride of three doubles in <see cref="NodeHistogram"/>; the histogram is 2 KB and stays
/// in the first-level cache. A field never carries into the next while every sum stays below
/// 2^21 (<see cref="MaxFieldValue"/>), which the builder checks once per tree. Integer sums read
/// out as doubles equal the double histogram's sums bit for bit (integers below 2^53 add exactly),
/// so the split found is the same. Empty codes are skipped as in <see cref="NodeHistogram"/>:
/// small nodes record the codes hit in a 256-bit mask and only those entries are cleared again.
/// </remarks>
internal sealed class PackedBinaryHistogram
{
    public const int FieldBits = 21;
    public const ulong FieldMask = (1UL << FieldBits) - 1;
    public const int RowShift = 2 * FieldBits;

    /// <summary>The largest weight sum or row count a field holds without carrying.</summary>
    public const long MaxFieldValue = (long)FieldMask;

    private readonly ulong[] _entries = new ulong[256];
    private readonly byte[] _valueCodes = new byte[256];
    private readonly ulong[] _presence = new ulong[256 / 64];

    /// <summary>The bytes of the histogram's buffers.</summary>
    public const long Bytes = 256 * sizeof(ulong) + 256 + 256 / 8;

    /// <summary>A row's increment: its integer weight in its class's field, one in the row field.</summary>
    public static ulong Increment(int classCode, ulong weight) => (weight << (classCode * FieldBits)) | (1UL << RowShift);

    public static double Class0(ulong entry) => entry & FieldMask;
    public static double Class1(ulong entry) => (entry >> FieldBits) & FieldMask;
    public static double Rows(ulong entry) => entry >> RowShift;

    public int ValueEntryCount { get; private set; }
    public int MissingCode { get; private set; }

    /// <summary>Every code's word; zero for codes holding no sample.</summary>
    public ReadOnlySpan<ulong> Entries => _entries;
    public ReadOnlySpan<byte> ValueCodes => _valueCodes.AsSpan(0, ValueEntryCount);
    public ulong Missing => _entries[MissingCode];
    public ulong BelowDetection => _entries[MissingCode + 1];

    public bool IsConstant => ValueEntryCount + (Missing != 0 ? 1 : 0) + (BelowDetection != 0 ? 1 : 0) <= 1;

    /// <summary>Fills from the codes of the node's rows; increments run parallel to rows.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Fill(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<ulong> increments, int valueBinCount)
    {
        if (increments.Length < rows.Length) throw new ArgumentException("Row arrays differ in length.");
        ClearPrevious(valueBinCount);
        // Rows index the codes and codes index the 256 entries: in range by construction.
        ref ulong entry0 = ref MemoryMarshal.GetArrayDataReference(_entries);
        ref byte code0 = ref MemoryMarshal.GetReference(codes);
        ref int row0 = ref MemoryMarshal.GetReference(rows);
        ref ulong increment0 = ref MemoryMarshal.GetReference(increments);
        var valueCodes = _valueCodes.AsSpan();
        int listed = 0;
        if (rows.Length >= valueBinCount)
        {
            for (int i = 0; i < rows.Length; i++)
                Unsafe.Add(ref entry0, Unsafe.Add(ref code0, Unsafe.Add(ref row0, i))) += Unsafe.Add(ref increment0, i);
            for (int code = 0; code < valueBinCount; code++)
                if (Unsafe.Add(ref entry0, code) != 0) valueCodes[listed++] = (byte)code;
        }
        else
        {
            ref ulong mask0 = ref MemoryMarshal.GetArrayDataReference(_presence);
            for (int i = 0; i < rows.Length; i++)
            {
                int code = Unsafe.Add(ref code0, Unsafe.Add(ref row0, i));
                Unsafe.Add(ref entry0, code) += Unsafe.Add(ref increment0, i);
                Unsafe.Add(ref mask0, code >> 6) |= 1UL << code;
            }
            for (int word = 0; word < _presence.Length; word++)
            {
                ulong bits = _presence[word];
                _presence[word] = 0;
                while (bits != 0)
                {
                    int code = (word << 6) + BitOperations.TrailingZeroCount(bits);
                    bits &= bits - 1;
                    if (code < valueBinCount) valueCodes[listed++] = (byte)code;
                }
            }
        }
        ValueEntryCount = listed;
    }

    /// <summary>Zeroes the entries the previous fill touched, then records the new feature's missing code.</summary>
    private void ClearPrevious(int valueBinCount)
    {
        var entries = _entries.AsSpan();
        foreach (byte code in _valueCodes.AsSpan(0, ValueEntryCount)) entries[code] = 0;
        entries[MissingCode] = 0;
        entries[MissingCode + 1] = 0;
        ValueEntryCount = 0;
        MissingCode = valueBinCount;
    }
}
