using System.Numerics;
using System.Runtime.CompilerServices;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The class weights and row counts of one node's samples for one feature, by code, with the
/// list of value codes that hold any sample (in increasing order). Per-thread scratch sized
/// once; reused by every feature of every node of every tree.
/// </summary>
/// <remarks>
/// Each code's entry is <see cref="Stride"/> doubles at code·Stride: the weight of each class,
/// then the row count. Filling costs O(rows + distinct codes), not O(codes): a 256-bit presence
/// mask records which codes were hit, its set bits enumerate the non-empty codes in order, and
/// only those entries are zeroed again at the next fill. So a node of 3 samples does not pay
/// for clearing and scanning 256 bins, which is what makes leaves-to-purity trees cheap.
/// </remarks>
internal sealed class NodeHistogram
{
    private const int MaskWords = 256 / 64;
    private readonly double[] _entries;
    private readonly byte[] _valueCodes;
    private readonly ulong[] _presence = new ulong[MaskWords];

    public NodeHistogram(int classCount, int maxCodeCount)
    {
        ClassCount = classCount;
        Stride = classCount + 1;
        _entries = new double[Math.Max(maxCodeCount, 256) * Stride];
        _valueCodes = new byte[256];
    }

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
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Fill(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        int stride = Stride;
        int classCount = ClassCount;
        var entries = _entries.AsSpan();
        ClearPrevious(entries);
        MissingCode = valueBinCount;
        var presence = _presence.AsSpan(0, MaskWords);
        for (int i = 0; i < rows.Length; i++)
        {
            int code = codes[rows[i]];
            int at = code * stride;
            entries[at + rowClasses[i]] += rowWeights[i];
            entries[at + classCount] += 1;
            presence[code >> 6] |= 1UL << code;
        }
        // Set bits in increasing order give the non-empty codes sorted; the mask is left zero.
        var valueCodes = _valueCodes.AsSpan();
        int listed = 0;
        for (int word = 0; word < MaskWords; word++)
        {
            ulong bits = presence[word];
            presence[word] = 0;
            while (bits != 0)
            {
                int code = (word << 6) + BitOperations.TrailingZeroCount(bits);
                bits &= bits - 1;
                if (code < valueBinCount) valueCodes[listed++] = (byte)code;
            }
        }
        ValueEntryCount = listed;
    }

    /// <summary>Zeroes the entries the previous fill touched: its listed value codes and its two unmeasured codes.</summary>
    private void ClearPrevious(Span<double> entries)
    {
        int stride = Stride;
        var previous = _valueCodes.AsSpan(0, ValueEntryCount);
        for (int j = 0; j < previous.Length; j++)
        {
            int at = previous[j] * stride;
            for (int k = 0; k < stride; k++) entries[at + k] = 0;
        }
        entries.Slice(MissingCode * stride, 2 * stride).Clear();
        ValueEntryCount = 0;
    }
}
