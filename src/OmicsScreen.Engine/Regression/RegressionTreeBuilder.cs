using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Regression;

/// <summary>
/// Grows one regression tree at a time, depth first, on the decrease in squared error (CART;
/// Breiman et al. 1984, ch. 8) with a random subset of features at each node (Breiman 2001).
/// One builder per thread; buffers sized once and reused by every node of every tree.
/// </summary>
/// <remarks>
/// With weights w and outcome y, a node's weighted squared error about its mean is
/// Q - S²/W (W = Σw, S = Σwy, Q = Σwy²), so a split's decrease is S_L²/W_L + S_R²/W_R - S²/W:
/// the split search needs only per-code sums of w and wy, and the proxy S_L²/W_L + S_R²/W_R
/// orders candidates as the decrease does. Feature draws, stopping rules, unmeasured-cell
/// routing and tie handling follow the classification builder, so the two kinds of tree differ
/// only in what a node accumulates.
/// </remarks>
internal sealed class RegressionTreeBuilder
{
    /// <summary>Per code: weight, weighted outcome sum, row count.</summary>
    private const int Stride = 3;

    private readonly int[] _rows;
    private readonly double[] _targets;
    private readonly double[] _weights;
    private readonly int[] _featureOrder;
    private readonly double[] _entries = new double[256 * Stride];
    private readonly byte[] _valueCodes = new byte[256];
    private readonly ulong[] _presence = new ulong[256 / 64];
    private int _valueEntryCount;
    private int _missingCode;
    private readonly Stack<(int Start, int End, int Depth, int Parent, bool IsLeft)> _pending = new();
    private readonly RegressionTreeBuffer _buffer = new();

    public RegressionTreeBuilder(int maxRows, int featureCount)
    {
        _rows = new int[maxRows];
        _targets = new double[maxRows];
        _weights = new double[maxRows];
        _featureOrder = new int[featureCount];
    }

    /// <summary>
    /// Grows a tree on the given in-bag rows (distinct), their outcomes and weights (bootstrap
    /// count times any sample weight), drawing features from generator.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public RegressionTree Grow(BinnedMatrix matrix, ReadOnlySpan<int> rows, ReadOnlySpan<double> targets,
        ReadOnlySpan<double> weights, TreeOptions options, ref Xoshiro256StarStar generator)
    {
        int rowCount = rows.Length;
        rows.CopyTo(_rows);
        targets.CopyTo(_targets);
        weights.CopyTo(_weights);
        int featureCount = matrix.FeatureCount;
        for (int f = 0; f < featureCount; f++) _featureOrder[f] = f;
        int featuresPerSplit = options.ResolveFeaturesPerSplit(featureCount);

        _buffer.Clear();
        _pending.Clear();
        double rootWeight = 0;
        for (int i = 0; i < rowCount; i++) rootWeight += _weights[i];
        _pending.Push((0, rowCount, 0, -1, false));
        while (_pending.Count > 0)
        {
            var (start, end, depth, parent, isLeft) = _pending.Pop();
            int nodeRows = end - start;
            int node = _buffer.Add(parent, isLeft, nodeRows);
            var (weight, sum, constant) = SumNode(start, end);
            _buffer.SetMean(node, weight > 0 ? sum / weight : 0.0);

            if (depth >= options.MaxDepth || nodeRows < 2 * options.MinLeafSize || nodeRows < 2 || constant || weight <= 0)
                continue;
            var best = FindSplit(matrix, start, end, weight, sum, featuresPerSplit, options.MinLeafSize, ref generator);
            if (!best.IsFound) continue;
            double decrease = Math.Max(0.0, (best.Score - sum * sum / weight) / rootWeight);
            if (decrease + 1e-12 < options.MinImpurityDecrease) continue;

            var bins = matrix.Bins(best.Feature);
            int middle = RowPartition.Split(matrix.Codes(best.Feature), _rows, _weights, _targets, start, end,
                best.BinThreshold, bins.MissingCode, best.Routing);
            _buffer.SetSplit(node, best.Feature, best.BinThreshold, bins.UpperBound(best.BinThreshold), bins.MissingCode,
                best.Routing, decrease);
            _pending.Push((middle, end, depth + 1, node, false));
            _pending.Push((start, middle, depth + 1, node, true));
        }
        return _buffer.ToTree();
    }

    private (double Weight, double Sum, bool Constant) SumNode(int start, int end)
    {
        double weight = 0, sum = 0;
        double first = _targets[start];
        bool constant = true;
        for (int i = start; i < end; i++)
        {
            double w = _weights[i], y = _targets[i];
            weight += w;
            sum += w * y;
            constant &= y == first;
        }
        return (weight, sum, constant);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private SplitCandidate FindSplit(BinnedMatrix matrix, int start, int end, double nodeWeight, double nodeSum,
        int featuresPerSplit, int minLeafSize, ref Xoshiro256StarStar generator)
    {
        var best = SplitCandidate.None;
        var rows = _rows.AsSpan(start, end - start);
        var targets = _targets.AsSpan(start, end - start);
        var weights = _weights.AsSpan(start, end - start);
        var order = _featureOrder.AsSpan();
        int tried = 0;
        // Features are drawn without replacement (partial Fisher-Yates); a feature constant in this
        // node does not count towards the features tried (as in scikit-learn). The first k are drawn
        // up front so that codes can be prefetched ahead of the search, and one more per constant
        // feature met: the same draws as drawing one at a time (see TreeBuilder.FindSplit).
        int drawn = 0;
        for (int planned = Math.Min(featuresPerSplit, order.Length); drawn < planned; drawn++) Draw(order, drawn, ref generator);
        for (int ahead = 0; ahead < 2 * PrefetchDistance && ahead < drawn; ahead++) matrix.PrefetchColumnEntry(order[ahead]);
        for (int ahead = 0; ahead < PrefetchDistance && ahead < drawn; ahead++) matrix.PrefetchCodes(order[ahead], rows);
        for (int next = 0; next < order.Length && tried < featuresPerSplit; next++)
        {
            if (next == drawn) Draw(order, drawn++, ref generator);
            else
            {
                if (next + 2 * PrefetchDistance < drawn) matrix.PrefetchColumnEntry(order[next + 2 * PrefetchDistance]);
                if (next + PrefetchDistance < drawn) matrix.PrefetchCodes(order[next + PrefetchDistance], rows);
            }
            int feature = order[next];
            int valueBins = matrix.ValueBinCount(feature);
            Fill(matrix.Codes(feature), rows, targets, weights, valueBins);
            if (IsConstant) continue;
            tried++;
            Scan(feature, valueBins, nodeWeight, nodeSum, end - start, minLeafSize, ref best);
        }
        return best;
    }

    /// <summary>How many features ahead of the one being searched their codes are prefetched (as in TreeBuilder).</summary>
    private const int PrefetchDistance = 8;

    private static void Draw(Span<int> order, int position, ref Xoshiro256StarStar generator)
    {
        int pick = position + generator.NextInt(order.Length - position);
        (order[position], order[pick]) = (order[pick], order[position]);
    }

    private double MissingRows => _entries[_missingCode * Stride + 2];
    private double BelowDetectionRows => _entries[(_missingCode + 1) * Stride + 2];

    private bool IsConstant => _valueEntryCount + (MissingRows > 0 ? 1 : 0) + (BelowDetectionRows > 0 ? 1 : 0) <= 1;

    /// <summary>
    /// Per-code sums of the node's rows for one feature. Small nodes record the codes hit in a
    /// 256-bit mask and list them from it, so a leaf-sized node does not scan 256 bins.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Fill(ReadOnlySpan<byte> codes, ReadOnlySpan<int> rows, ReadOnlySpan<double> targets,
        ReadOnlySpan<double> weights, int valueBinCount)
    {
        // Zero what the previous fill touched, then record the new feature's missing code.
        var entries = _entries.AsSpan();
        for (int j = 0; j < _valueEntryCount; j++) entries.Slice(_valueCodes[j] * Stride, Stride).Clear();
        entries.Slice(_missingCode * Stride, 2 * Stride).Clear();
        _missingCode = valueBinCount;

        bool sparse = rows.Length < valueBinCount;
        ref double entry0 = ref MemoryMarshal.GetArrayDataReference(_entries);
        ref byte code0 = ref MemoryMarshal.GetReference(codes);
        ref ulong mask0 = ref MemoryMarshal.GetArrayDataReference(_presence);
        for (int i = 0; i < rows.Length; i++)
        {
            int code = Unsafe.Add(ref code0, rows[i]);
            ref double entry = ref Unsafe.Add(ref entry0, code * Stride);
            double w = weights[i];
            entry += w;
            Unsafe.Add(ref entry, 1) += w * targets[i];
            Unsafe.Add(ref entry, 2) += 1;
            if (sparse) Unsafe.Add(ref mask0, code >> 6) |= 1UL << code;
        }

        int listed = 0;
        if (sparse)
        {
            for (int word = 0; word < _presence.Length; word++)
            {
                ulong bits = _presence[word];
                _presence[word] = 0;
                while (bits != 0)
                {
                    int code = (word << 6) + BitOperations.TrailingZeroCount(bits);
                    bits &= bits - 1;
                    if (code < valueBinCount) _valueCodes[listed++] = (byte)code;
                }
            }
        }
        else
        {
            for (int code = 0; code < valueBinCount; code++)
                if (entries[code * Stride + 2] != 0) _valueCodes[listed++] = (byte)code;
        }
        _valueEntryCount = listed;
    }

    /// <summary>
    /// Every cut between adjacent non-empty value codes, crossed with every side for the missing
    /// and below-detection groups the node holds; replaces best only on a strictly higher score.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Scan(int feature, int valueBinCount, double nodeWeight, double nodeSum, int nodeRows, int minLeafSize,
        ref SplitCandidate best)
    {
        bool hasMissing = MissingRows > 0;
        bool hasBelow = BelowDetectionRows > 0;
        var entries = _entries.AsSpan();
        int missingAt = _missingCode * Stride, belowAt = (_missingCode + 1) * Stride;
        for (int combination = 0; combination < 4; combination++)
        {
            bool missingLeft = (combination & 1) != 0;
            bool belowLeft = (combination & 2) != 0;
            if ((missingLeft && !hasMissing) || (belowLeft && !hasBelow)) continue;
            double leftWeight = 0, leftSum = 0, leftRows = 0;
            if (missingLeft) { leftWeight += entries[missingAt]; leftSum += entries[missingAt + 1]; leftRows += entries[missingAt + 2]; }
            if (belowLeft) { leftWeight += entries[belowAt]; leftSum += entries[belowAt + 1]; leftRows += entries[belowAt + 2]; }
            if (_valueEntryCount == 0)
            {
                // Only unmeasured cells here: the one split is missing versus below detection.
                if (combination == 1 && hasBelow)
                    Consider(feature, (byte)(valueBinCount - 1), leftWeight, leftSum, leftRows, nodeWeight, nodeSum, nodeRows,
                        minLeafSize, hasMissing, hasBelow, missingLeft, belowLeft, ref best);
                continue;
            }
            // Invariant: after step j the left sums hold the placed groups plus value codes[0..j].
            for (int j = 0; j < _valueEntryCount; j++)
            {
                int at = _valueCodes[j] * Stride;
                leftWeight += entries[at];
                leftSum += entries[at + 1];
                leftRows += entries[at + 2];
                Consider(feature, _valueCodes[j], leftWeight, leftSum, leftRows, nodeWeight, nodeSum, nodeRows,
                    minLeafSize, hasMissing, hasBelow, missingLeft, belowLeft, ref best);
            }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Consider(int feature, byte binThreshold, double leftWeight, double leftSum, double leftRows,
        double nodeWeight, double nodeSum, int nodeRows, int minLeafSize, bool hasMissing, bool hasBelow,
        bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        double rightRows = nodeRows - leftRows;
        if (leftRows < minLeafSize || rightRows < minLeafSize) return;
        double rightWeight = nodeWeight - leftWeight;
        if (leftWeight <= 0 || rightWeight <= 0) return;
        double rightSum = nodeSum - leftSum;
        double score = leftSum * leftSum / leftWeight + rightSum * rightSum / rightWeight;
        if (!(score > best.Score)) return;
        best = SplitScanner.Record(feature, binThreshold, score, leftRows, rightRows, hasMissing, hasBelow, missingLeft, belowLeft);
    }

}

/// <summary>A <see cref="SplitTopologyBuffer"/> with each node's mean and variance decrease, reused across trees.</summary>
internal sealed class RegressionTreeBuffer
{
    private readonly SplitTopologyBuffer _topology = new();
    private double[] _means = new double[64];
    private double[] _decreases = new double[64];

    public void Clear() => _topology.Clear();

    public int Add(int parent, bool isLeft, int sampleCount)
    {
        int node = _topology.Add(parent, isLeft, sampleCount);
        if (_means.Length < _topology.Capacity)
        {
            Array.Resize(ref _means, _topology.Capacity);
            Array.Resize(ref _decreases, _topology.Capacity);
        }
        _decreases[node] = 0;
        return node;
    }

    public void SetMean(int node, double mean) => _means[node] = mean;

    public void SetSplit(int node, int feature, byte binThreshold, float threshold, byte missingCode,
        UnmeasuredRouting routing, double decrease)
    {
        _topology.SetSplit(node, feature, binThreshold, threshold, missingCode, routing);
        _decreases[node] = decrease;
    }

    public RegressionTree ToTree() => new(_topology.ToTopology(), _means[.._topology.Count], _decreases[.._topology.Count]);
}
