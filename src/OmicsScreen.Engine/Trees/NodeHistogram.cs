namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The class weights and row counts of one node's samples for one feature, compacted to the
/// value bins that hold any sample (in code order) plus the missing and below-detection groups.
/// Per-thread scratch sized once for the largest code count; reused by every node of every tree.
/// </summary>
/// <remarks>
/// Each entry is <see cref="Stride"/> doubles: the weight of each class, then the row count.
/// Two ways to fill it give the same entries: a full histogram over all codes (cost rows + codes)
/// for large nodes, and sorting packed (code, position) keys (cost rows·log rows) for small nodes,
/// where clearing and scanning hundreds of empty bins would dominate.
/// </remarks>
internal sealed class NodeHistogram
{
    private readonly double[] _full;
    private readonly double[] _values;
    private readonly byte[] _valueCodes;
    private readonly double[] _missing;
    private readonly double[] _belowDetection;
    private readonly uint[] _sortKeys;

    public NodeHistogram(int classCount, int maxCodeCount, int maxRows)
    {
        ClassCount = classCount;
        Stride = classCount + 1;
        _full = new double[maxCodeCount * Stride];
        _values = new double[maxCodeCount * Stride];
        _valueCodes = new byte[maxCodeCount];
        _missing = new double[Stride];
        _belowDetection = new double[Stride];
        _sortKeys = new uint[maxRows];
    }

    public int ClassCount { get; }
    public int Stride { get; }

    /// <summary>Number of non-empty value bins.</summary>
    public int ValueEntryCount { get; private set; }

    public ReadOnlySpan<double> ValueEntry(int entry) => _values.AsSpan(entry * Stride, Stride);
    public byte ValueCode(int entry) => _valueCodes[entry];
    public ReadOnlySpan<double> Missing => _missing;
    public ReadOnlySpan<double> BelowDetection => _belowDetection;
    public double MissingRows => _missing[ClassCount];
    public double BelowDetectionRows => _belowDetection[ClassCount];

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

    internal void FillByHistogram(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        int stride = Stride;
        int classCount = ClassCount;
        var full = _full.AsSpan(0, (valueBinCount + 2) * stride);
        full.Clear();
        for (int i = 0; i < rows.Length; i++)
        {
            int at = codes[rows[i]] * stride;
            full[at + rowClasses[i]] += rowWeights[i];
            full[at + classCount] += 1;
        }
        int entries = 0;
        for (int code = 0; code < valueBinCount; code++)
        {
            int at = code * stride;
            if (full[at + classCount] == 0) continue;
            full.Slice(at, stride).CopyTo(_values.AsSpan(entries * stride, stride));
            _valueCodes[entries++] = (byte)code;
        }
        ValueEntryCount = entries;
        full.Slice(valueBinCount * stride, stride).CopyTo(_missing);
        full.Slice((valueBinCount + 1) * stride, stride).CopyTo(_belowDetection);
    }

    internal void FillBySorting(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int valueBinCount)
    {
        int stride = Stride;
        int classCount = ClassCount;
        var keys = _sortKeys.AsSpan(0, rows.Length);
        // Key = code in the top byte, position in the node below it (positions < 2^24), so the
        // sort groups equal codes and keeps the result independent of the sort's stability.
        for (int i = 0; i < rows.Length; i++) keys[i] = ((uint)codes[rows[i]] << 24) | (uint)i;
        keys.Sort();
        Array.Clear(_missing);
        Array.Clear(_belowDetection);
        int entries = 0;
        int previousCode = -1;
        Span<double> target = default;
        foreach (uint key in keys)
        {
            int code = (int)(key >> 24);
            int position = (int)(key & 0xFFFFFF);
            if (code != previousCode)
            {
                previousCode = code;
                if (code < valueBinCount)
                {
                    target = _values.AsSpan(entries * stride, stride);
                    target.Clear();
                    _valueCodes[entries++] = (byte)code;
                }
                else target = code == valueBinCount ? _missing : _belowDetection;
            }
            target[rowClasses[position]] += rowWeights[position];
            target[classCount] += 1;
        }
        ValueEntryCount = entries;
    }
}
