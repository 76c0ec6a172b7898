using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The class weights and row counts of one node's samples for one feature, by code, with the
/// list of value codes that hold any sample (in increasing order). Per-thread scratch sized
/// once; reused by every feature of every node of every tree.
/// </summary>
/// <remarks>
/// Each code's entry is <see cref="Stride"/> doubles at code·Stride: the weight of each class,
/// then the row count. Filling costs O(rows + distinct codes), not O(codes): for small nodes a
/// 256-bit presence mask records which codes were hit and its set bits enumerate the non-empty
/// codes in order; only those entries are zeroed again at the next fill. So a node of 3 samples
/// does not pay for clearing and scanning 256 bins, which is what makes leaves-to-purity trees
/// cheap. Nodes with at least as many rows as codes just scan the codes.
/// </remarks>
internal sealed class NodeHistogram
{
    private readonly double[] _entries;
    private readonly byte[] _valueCodes;
    private readonly ulong[] _presence = new ulong[256 / 64];

    public NodeHistogram(int classCount, int maxCodeCount)
    {
        ClassCount = classCount;
        Stride = classCount + 1;
        _entries = new double[Math.Max(maxCodeCount, 256) * Stride];
        _valueCodes = new byte[256];
    }

    /// <summary>The entries' bytes for a class count: 256 codes of class weights plus a row count, as doubles.</summary>
    public static long BytesFor(int classCount) => 256L * (classCount + 1) * sizeof(double);

    public int ClassCount { get; }
    public int Stride { get; }

    /// <summary>Number of value codes holding any sample.</summary>
    public int ValueEntryCount { get; private set; }

    /// <summary>The missing code of the feature last filled (= its value bin count).</summary>
    public int MissingCode { get; private set; }

    /// <summary>Every code's entry, code-major; zero for codes holding no sample.</summary>
    public ReadOnlySpan<double> Entries => _entries;

    /// <summary>The non-empty value codes in increasing order.</summary>
    public ReadOnlySpan<byte> ValueCodes => _valueCodes.AsSpan(0, ValueEntryCount);

    public ReadOnlySpan<double> Entry(int code) => _entries.AsSpan(code * Stride, Stride);
    public ReadOnlySpan<double> Missing => Entry(MissingCode);
    public ReadOnlySpan<double> BelowDetection => Entry(MissingCode + 1);
    public double MissingRows => _entries[MissingCode * Stride + ClassCount];
    public double BelowDetectionRows => _entries[(MissingCode + 1) * Stride + ClassCount];

    /// <summary>True when all the node's samples share one code, so no split on this feature exists.</summary>
    public bool IsConstant =>
        ValueEntryCount + (MissingRows > 0 ? 1 : 0) + (BelowDetectionRows > 0 ? 1 : 0) <= 1;

    /// <summary>Fills from the codes of the node's rows; rowClasses and rowWeights run parallel to rows.</summary>
    /// <remarks>
    /// Rows index the codes, classes index a class, codes index an entry: all are in range by
    /// construction (rows come from the panel, codes are bytes, the entry array holds 256 codes),
    /// so the loops use unchecked references; this loop is where a forest spends most of its time.
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Fill(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        if (rowClasses.Length < rows.Length || rowWeights.Length < rows.Length) throw new ArgumentException("Row arrays differ in length.");
        if (rows.Length >= valueBinCount) FillDense(codes, rows, rowClasses, rowWeights, valueBinCount);
        else FillSparse(codes, rows, rowClasses, rowWeights, valueBinCount);
    }

    /// <summary>Many rows per code: accumulate, then list the codes by scanning every value code once.</summary>
    internal void FillDense(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        ClearPrevious(valueBinCount);
        Accumulate(codes, rows, rowClasses, rowWeights, trackPresence: false);
        int stride = Stride;
        var entries = _entries.AsSpan();
        var valueCodes = _valueCodes.AsSpan();
        int listed = 0;
        for (int code = 0; code < valueBinCount; code++)
            if (entries[code * stride + ClassCount] != 0) valueCodes[listed++] = (byte)code;
        ValueEntryCount = listed;
    }

    /// <summary>
    /// Few rows per code: a 256-bit presence mask records the codes hit, and its set bits, read
    /// in order, list them sorted in O(rows + distinct codes) rather than O(codes).
    /// </summary>
    internal void FillSparse(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        ClearPrevious(valueBinCount);
        Accumulate(codes, rows, rowClasses, rowWeights, trackPresence: true);
        var valueCodes = _valueCodes.AsSpan();
        int listed = 0;
        for (int word = 0; word < _presence.Length; word++)
        {
            listed = ListCodes(_presence[word], word << 6, valueBinCount, valueCodes, listed);
            _presence[word] = 0;
        }
        ValueEntryCount = listed;
    }

    /// <summary>Adds each row's weight to its class and one to the row count of its code's entry.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Accumulate(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, bool trackPresence)
    {
        int stride = Stride;
        int classCount = ClassCount;
        ref double entry0 = ref MemoryMarshal.GetArrayDataReference(_entries);
        ref byte code0 = ref MemoryMarshal.GetReference(codes);
        ref int class0 = ref MemoryMarshal.GetReference(rowClasses);
        ref double weight0 = ref MemoryMarshal.GetReference(rowWeights);
        ref ulong mask0 = ref MemoryMarshal.GetArrayDataReference(_presence);
        for (int i = 0; i < rows.Length; i++)
        {
            int code = Unsafe.Add(ref code0, rows[i]);
            ref double entry = ref Unsafe.Add(ref entry0, code * stride);
            Unsafe.Add(ref entry, Unsafe.Add(ref class0, i)) += Unsafe.Add(ref weight0, i);
            Unsafe.Add(ref entry, classCount) += 1;
            // The shift uses the low 6 bits of the code, its top 2 bits pick the mask word; the
            // test is the same for every row of a call, so it is always predicted.
            if (trackPresence) Unsafe.Add(ref mask0, code >> 6) |= 1UL << code;
        }
    }

    /// <summary>Appends the value codes of one mask word in increasing order.</summary>
    private static int ListCodes(ulong bits, int firstCode, int valueBinCount, Span<byte> valueCodes, int listed)
    {
        while (bits != 0)
        {
            int code = firstCode + BitOperations.TrailingZeroCount(bits);
            bits &= bits - 1;
            if (code < valueBinCount) valueCodes[listed++] = (byte)code;
        }
        return listed;
    }

    /// <summary>Zeroes the entries the previous fill touched: its listed value codes and its two unmeasured codes.</summary>
    /// <remarks>Then records the missing code of the feature about to be filled.</remarks>
    private void ClearPrevious(int valueBinCount)
    {
        var entries = _entries.AsSpan();
        int stride = Stride;
        var previous = _valueCodes.AsSpan(0, ValueEntryCount);
        for (int j = 0; j < previous.Length; j++)
        {
            int at = previous[j] * stride;
            for (int k = 0; k < stride; k++) entries[at + k] = 0;
        }
        entries.Slice(MissingCode * stride, 2 * stride).Clear();
        ValueEntryCount = 0;
        MissingCode = valueBinCount;
    }
}
