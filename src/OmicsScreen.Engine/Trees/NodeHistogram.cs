using System.Runtime.CompilerServices;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The class weights and row counts of one node's samples for one feature, by code, with the
/// list of value codes that hold any sample (in increasing order). Per-thread scratch sized
/// once for the largest code count; reused by every node of every tree.
/// </summary>
/// <remarks>
/// Each code's entry is <see cref="Stride"/> doubles at code·Stride: the weight of each class,
/// then the row count. Two ways to fill it give the same entries for every listed code and for
/// the missing and below-detection codes: a full histogram over all codes (cost rows + codes)
/// for large nodes, and sorting packed (code, position) keys (cost rows·log rows) for small
/// nodes, where clearing and scanning hundreds of empty bins would dominate. Entries of unlisted
/// value codes are stale and never read.
/// </remarks>
internal sealed class NodeHistogram
{
    private readonly double[] _entries;
    private readonly byte[] _valueCodes;
    private readonly uint[] _sortKeys;

    public NodeHistogram(int classCount, int maxCodeCount, int maxRows)
    {
        ClassCount = classCount;
        Stride = classCount + 1;
        _entries = new double[maxCodeCount * Stride];
        _valueCodes = new byte[maxCodeCount];
        _sortKeys = new uint[maxRows];
    }

    public int ClassCount { get; }
    public int Stride { get; }

    /// <summary>Number of value codes holding any sample.</summary>
    public int ValueEntryCount { get; private set; }

    /// <summary>The missing code of the feature last filled (= its value bin count).</summary>
    public int MissingCode { get; private set; }

    /// <summary>Every code's entry, code-major; read only listed codes and the two unmeasured codes.</summary>
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

    /// <summary>Sorting pays when clearing and scanning every code would cost more than sorting the rows.</summary>
    public static bool PrefersSorting(int rowCount, int codeCount) => rowCount * 4 < codeCount;

    /// <summary>Fills from the codes of the node's rows; rowClasses and rowWeights run parallel to rows.</summary>
    public void Fill(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        if (PrefersSorting(rows.Length, valueBinCount + 2)) FillBySorting(codes, rows, rowClasses, rowWeights, valueBinCount);
        else FillByHistogram(codes, rows, rowClasses, rowWeights, valueBinCount);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal void FillByHistogram(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        int stride = Stride;
        int classCount = ClassCount;
        MissingCode = valueBinCount;
        var entries = _entries.AsSpan(0, (valueBinCount + 2) * stride);
        entries.Clear();
        for (int i = 0; i < rows.Length; i++)
        {
            int at = codes[rows[i]] * stride;
            entries[at + rowClasses[i]] += rowWeights[i];
            entries[at + classCount] += 1;
        }
        int listed = 0;
        var valueCodes = _valueCodes.AsSpan();
        for (int code = 0; code < valueBinCount; code++)
            if (entries[code * stride + classCount] != 0) valueCodes[listed++] = (byte)code;
        ValueEntryCount = listed;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal void FillBySorting(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        int stride = Stride;
        int classCount = ClassCount;
        MissingCode = valueBinCount;
        var keys = _sortKeys.AsSpan(0, rows.Length);
        // Key = code in the top byte, position in the node below it (positions < 2^24), so the
        // sort groups equal codes and keeps the result independent of the sort's stability.
        for (int i = 0; i < rows.Length; i++) keys[i] = ((uint)codes[rows[i]] << 24) | (uint)i;
        keys.Sort();
        var entries = _entries.AsSpan();
        entries.Slice(valueBinCount * stride, 2 * stride).Clear();
        var valueCodes = _valueCodes.AsSpan();
        int listed = 0;
        int previousCode = -1;
        int at = 0;
        foreach (uint key in keys)
        {
            int code = (int)(key >> 24);
            int position = (int)(key & 0xFFFFFF);
            if (code != previousCode)
            {
                previousCode = code;
                at = code * stride;
                if (code < valueBinCount)
                {
                    entries.Slice(at, stride).Clear();
                    valueCodes[listed++] = (byte)code;
                }
            }
            entries[at + rowClasses[position]] += rowWeights[position];
            entries[at + classCount] += 1;
        }
        ValueEntryCount = listed;
    }
}
