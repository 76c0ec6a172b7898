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

    // Zero between fills: each fill empties the words it filled while it lists them.
    private readonly ulong[] _entries = new ulong[256];
    private readonly byte[] _valueCodes = new byte[256];
    private readonly ulong[] _cumulative = new ulong[256];

    /// <summary>The bytes of the histogram's buffers.</summary>
    public const long Bytes = 2 * 256 * sizeof(ulong) + 256;

    /// <summary>A row's increment: its integer weight in its class's field, one in the row field.</summary>
    public static ulong Increment(int classCode, ulong weight) => (weight << (classCode * FieldBits)) | (1UL << RowShift);

    public static double Class0(ulong entry) => entry & FieldMask;
    public static double Class1(ulong entry) => (entry >> FieldBits) & FieldMask;
    public static double Rows(ulong entry) => entry >> RowShift;

    public int ValueEntryCount { get; private set; }

    /// <summary>The value codes holding at least one row, ascending.</summary>
    public ReadOnlySpan<byte> ValueCodes => _valueCodes.AsSpan(0, ValueEntryCount);

    /// <summary>
    /// Entry k is the sum of the words of <see cref="ValueCodes"/>[0..k]: the left child's sums
    /// at the cut after that code, before any unmeasured group is placed. Integer sums, so
    /// adding a group afterwards gives the same word as adding it first.
    /// </summary>
    public ReadOnlySpan<ulong> CumulativeEntries => _cumulative.AsSpan(0, ValueEntryCount);

    /// <summary>The word of <see cref="ValueCodes"/>[k].</summary>
    public ulong ValueEntry(int k) => k == 0 ? _cumulative[0] : _cumulative[k] - _cumulative[k - 1];

    public ulong Missing { get; private set; }
    public ulong BelowDetection { get; private set; }

    public bool IsConstant => ValueEntryCount + (Missing != 0 ? 1 : 0) + (BelowDetection != 0 ? 1 : 0) <= 1;

    /// <summary>Fills from the codes of the node's rows; increments run parallel to rows.</summary>
    /// <remarks>
    /// One pass adds the rows' increments to their codes' words; a second lists the codes hit in
    /// ascending order, with the running sums the split scan needs, and zeroes each word as it
    /// goes, so no separate pass clears the histogram or sums the cuts. Small nodes find the codes
    /// hit from a 256-bit mask set in the first pass, large ones by looking at every value code.
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Fill(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<ulong> increments, int valueBinCount)
    {
        if (increments.Length < rows.Length) throw new ArgumentException("Row arrays differ in length.");
        // Rows index the codes and codes index the 256 entries: in range by construction.
        ref ulong entry0 = ref MemoryMarshal.GetArrayDataReference(_entries);
        ref byte code0 = ref MemoryMarshal.GetReference(codes);
        ref int row0 = ref MemoryMarshal.GetReference(rows);
        ref ulong increment0 = ref MemoryMarshal.GetReference(increments);
        ref byte valueCode0 = ref MemoryMarshal.GetArrayDataReference(_valueCodes);
        ref ulong cumulative0 = ref MemoryMarshal.GetArrayDataReference(_cumulative);
        int listed = 0;
        ulong running = 0;
        if (rows.Length >= valueBinCount)
        {
            for (int i = 0; i < rows.Length; i++)
                Unsafe.Add(ref entry0, Unsafe.Add(ref code0, Unsafe.Add(ref row0, i))) += Unsafe.Add(ref increment0, i);
            for (int code = 0; code < valueBinCount; code++)
            {
                ulong word = Unsafe.Add(ref entry0, code);
                if (word == 0) continue;
                Unsafe.Add(ref entry0, code) = 0;
                running += word;
                Unsafe.Add(ref cumulative0, listed) = running;
                Unsafe.Add(ref valueCode0, listed++) = (byte)code;
            }
        }
        else
        {
            Span<ulong> presence = stackalloc ulong[4];
            for (int i = 0; i < rows.Length; i++)
            {
                int code = Unsafe.Add(ref code0, Unsafe.Add(ref row0, i));
                Unsafe.Add(ref entry0, code) += Unsafe.Add(ref increment0, i);
                presence[code >> 6] |= 1UL << code;
            }
            for (int word = 0; word < 4; word++)
            {
                ulong bits = presence[word];
                while (bits != 0)
                {
                    int code = (word << 6) + BitOperations.TrailingZeroCount(bits);
                    bits &= bits - 1;
                    if (code >= valueBinCount) break; // the unmeasured codes come last and are read below
                    ulong entry = Unsafe.Add(ref entry0, code);
                    Unsafe.Add(ref entry0, code) = 0;
                    running += entry;
                    Unsafe.Add(ref cumulative0, listed) = running;
                    Unsafe.Add(ref valueCode0, listed++) = (byte)code;
                }
            }
        }
        ValueEntryCount = listed;
        Missing = Unsafe.Add(ref entry0, valueBinCount);
        BelowDetection = Unsafe.Add(ref entry0, valueBinCount + 1);
        Unsafe.Add(ref entry0, valueBinCount) = 0;
        Unsafe.Add(ref entry0, valueBinCount + 1) = 0;
    }
}
