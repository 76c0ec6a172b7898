using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// Grows one classification tree at a time, depth first, on the Gini index (CART; Breiman et
/// al. 1984) with a random subset of features at each node (Breiman 2001). Owns the stopping
/// rules and node order; one builder per thread, its buffers sized once and reused by every node
/// of every tree it grows.
/// </summary>
/// <remarks>
/// The tree's in-bag rows sit in one array, each node owning a contiguous slice that is
/// partitioned in place; class codes and weights travel with the rows, so the only scattered
/// read in the hot loop is a feature's code of a row. As in scikit-learn, features found
/// constant in a node do not count towards the features tried, and drawing continues until
/// k non-constant features were tried or none are left.
/// </remarks>
internal sealed class TreeBuilder
{
    /// <summary>How many features ahead of the one being searched their codes are prefetched.</summary>
    private const int PrefetchDistance = 8;

    private readonly int _classCount;
    private readonly int _stride;
    private readonly int[] _rows;
    private readonly int[] _rowClasses;
    private readonly double[] _rowWeights;
    private readonly int[] _featureOrder;
    private readonly double[] _nodeTotals;
    private readonly ulong[] _rowIncrements;
    private readonly NodeHistogram _histogram;
    private readonly PackedBinaryHistogram _packedHistogram = new();
    private readonly SplitScanner _scanner;
    private readonly Stack<PendingNode> _pending = new();
    private readonly TreeBuffer _buffer;

    /// <summary>True while growing a tree whose two-class integer weights fit the packed histogram.</summary>
    private bool _packed;

    public TreeBuilder(int maxRows, int featureCount, int maxCodeCount, int classCount)
    {
        _classCount = classCount;
        _stride = classCount + 1;
        _rows = new int[maxRows];
        _rowClasses = new int[maxRows];
        _rowWeights = new double[maxRows];
        _rowIncrements = new ulong[classCount == 2 ? maxRows : 0];
        _featureOrder = new int[featureCount];
        _nodeTotals = new double[_stride];
        _histogram = new NodeHistogram(classCount, maxCodeCount);
        _scanner = new SplitScanner(classCount);
        _buffer = new TreeBuffer(classCount);
    }

    /// <summary>
    /// Grows a tree on the given in-bag rows (distinct), their classes and weights (bootstrap
    /// count times any sample weight), drawing features and breaking leaf ties from generator.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public DecisionTree Grow(BinnedMatrix matrix, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, TreeOptions options, ref Xoshiro256StarStar generator)
    {
        int rowCount = rows.Length;
        rows.CopyTo(_rows);
        rowClasses.CopyTo(_rowClasses);
        rowWeights.CopyTo(_rowWeights);
        _packed = Pack(rowCount);
        int featureCount = matrix.FeatureCount;
        for (int f = 0; f < featureCount; f++) _featureOrder[f] = f;
        int featuresPerSplit = options.ResolveFeaturesPerSplit(featureCount);

        _buffer.Clear();
        _pending.Clear();
        double rootWeight = 0;
        for (int i = 0; i < rowCount; i++) rootWeight += _rowWeights[i];
        _pending.Push(new PendingNode(0, rowCount, 0, -1, false));
        while (_pending.Count > 0)
        {
            var pending = _pending.Pop();
            int node = _buffer.Add(pending.Parent, pending.IsLeft, pending.End - pending.Start);
            var totals = _nodeTotals.AsSpan();
            SumNode(pending.Start, pending.End, totals);
            var classWeights = totals[.._classCount];
            _buffer.SetNode(node, classWeights, MajorityClass(classWeights, ref generator));

            int nodeRows = pending.End - pending.Start;
            if (pending.Depth >= options.MaxDepth || nodeRows < 2 * options.MinLeafSize || nodeRows < 2 || IsPure(classWeights))
                continue;
            var best = FindSplit(matrix, pending.Start, pending.End, totals, featuresPerSplit, options.MinLeafSize, ref generator);
            if (!best.IsFound) continue;
            double decrease = GiniImpurity.Decrease(best.Score, classWeights, rootWeight);
            if (decrease + 1e-12 < options.MinImpurityDecrease) continue;

            var bins = matrix.Bins(best.Feature);
            int middle = Partition(matrix.Codes(best.Feature), pending.Start, pending.End, best, bins.MissingCode);
            _buffer.SetSplit(node, best.Feature, best.BinThreshold, bins.UpperBound(best.BinThreshold), bins.MissingCode,
                best.Routing, decrease);
            _pending.Push(new PendingNode(middle, pending.End, pending.Depth + 1, node, false));
            _pending.Push(new PendingNode(pending.Start, middle, pending.Depth + 1, node, true));
        }
        return _buffer.ToTree();
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private SplitCandidate FindSplit(BinnedMatrix matrix, int start, int end, ReadOnlySpan<double> totals,
        int featuresPerSplit, int minLeafSize, ref Xoshiro256StarStar generator)
    {
        var best = SplitCandidate.None;
        var rows = _rows.AsSpan(start, end - start);
        var rowClasses = _rowClasses.AsSpan(start, end - start);
        var rowWeights = _rowWeights.AsSpan(start, end - start);
        var order = _featureOrder.AsSpan();
        // Partial Fisher-Yates: order[0..drawn) are this node's draws without replacement, in draw
        // order. The first k are drawn up front so the next feature's codes can be prefetched while
        // this one is searched; one more is drawn per constant feature met, so the draws (and the
        // generator's state) are exactly those of drawing one feature at a time.
        int drawn = 0;
        for (int planned = Math.Min(featuresPerSplit, order.Length); drawn < planned; drawn++) Draw(order, drawn, ref generator);
        for (int ahead = 0; ahead < 2 * PrefetchDistance && ahead < drawn; ahead++) matrix.PrefetchColumnEntry(order[ahead]);
        for (int ahead = 0; ahead < PrefetchDistance && ahead < drawn; ahead++) matrix.PrefetchCodes(order[ahead], rows);
        int tried = 0;
        for (int next = 0; next < order.Length && tried < featuresPerSplit; next++)
        {
            if (next == drawn) Draw(order, drawn++, ref generator);
            else
            {
                // Two steps: the entry saying where a feature's codes are, then the codes themselves.
                if (next + 2 * PrefetchDistance < drawn) matrix.PrefetchColumnEntry(order[next + 2 * PrefetchDistance]);
                if (next + PrefetchDistance < drawn) matrix.PrefetchCodes(order[next + PrefetchDistance], rows);
            }
            int feature = order[next];
            int valueBins = matrix.ValueBinCount(feature);
            if (_packed)
            {
                _packedHistogram.Fill(matrix.Codes(feature), rows, _rowIncrements.AsSpan(start, end - start), valueBins);
                if (_packedHistogram.IsConstant) continue;
                tried++;
                _scanner.ScanPacked(_packedHistogram, feature, valueBins, totals, minLeafSize, ref best);
                continue;
            }
            _histogram.Fill(matrix.Codes(feature), rows, rowClasses, rowWeights, valueBins);
            if (_histogram.IsConstant) continue;
            tried++;
            _scanner.Scan(_histogram, feature, valueBins, totals, minLeafSize, ref best);
        }
        return best;
    }

    private static void Draw(Span<int> order, int position, ref Xoshiro256StarStar generator)
    {
        int pick = position + generator.NextInt(order.Length - position);
        (order[position], order[pick]) = (order[pick], order[position]);
    }

    /// <summary>Moves the rows going left to the front of the slice; returns where the right child starts.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int Partition(ReadOnlySpan<byte> codes, int start, int end, in SplitCandidate split, byte missingCode)
    {
        byte threshold = split.BinThreshold;
        var routing = split.Routing;
        int low = start, high = end - 1;
        // Invariant: rows before low go left, rows after high go right.
        while (low <= high)
        {
            if (BranchRule.GoesLeft(codes[_rows[low]], threshold, missingCode, routing)) { low++; continue; }
            (_rows[low], _rows[high]) = (_rows[high], _rows[low]);
            // A packed tree's classes and weights travel in its increments alone.
            if (_packed) (_rowIncrements[low], _rowIncrements[high]) = (_rowIncrements[high], _rowIncrements[low]);
            else
            {
                (_rowClasses[low], _rowClasses[high]) = (_rowClasses[high], _rowClasses[low]);
                (_rowWeights[low], _rowWeights[high]) = (_rowWeights[high], _rowWeights[low]);
            }
            high--;
        }
        return low;
    }

    /// <summary>
    /// Whether this tree can use the packed two-class histogram: two classes, every weight a
    /// whole number (bootstrap counts without fractional sample weights), and the total weight
    /// small enough that no packed field can carry. Fills each row's increment when it can.
    /// </summary>
    private bool Pack(int rowCount)
    {
        if (_classCount != 2) return false;
        double total = 0;
        for (int i = 0; i < rowCount; i++)
        {
            double weight = _rowWeights[i];
            if (weight != Math.Floor(weight) || weight < 1) return false;
            total += weight;
        }
        if (total > PackedBinaryHistogram.MaxFieldValue) return false;
        for (int i = 0; i < rowCount; i++)
            _rowIncrements[i] = PackedBinaryHistogram.Increment(_rowClasses[i], (ulong)_rowWeights[i]);
        return true;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void SumNode(int start, int end, Span<double> totals)
    {
        totals.Clear();
        if (_packed)
        {
            // Whole-number sums: the same doubles as adding the weights one by one.
            ulong sum = 0;
            for (int i = start; i < end; i++) sum += _rowIncrements[i];
            totals[0] = PackedBinaryHistogram.Class0(sum);
            totals[1] = PackedBinaryHistogram.Class1(sum);
        }
        else for (int i = start; i < end; i++) totals[_rowClasses[i]] += _rowWeights[i];
        totals[_classCount] = end - start;
    }

    private static bool IsPure(ReadOnlySpan<double> classWeights)
    {
        int present = 0;
        foreach (double w in classWeights) if (w > 0) present++;
        return present <= 1;
    }

    /// <summary>The heaviest class; exact ties are broken at random, never towards the first class.</summary>
    private static int MajorityClass(ReadOnlySpan<double> classWeights, ref Xoshiro256StarStar generator)
    {
        int best = 0, tied = 1;
        for (int c = 1; c < classWeights.Length; c++)
        {
            if (classWeights[c] > classWeights[best]) { best = c; tied = 1; }
            else if (classWeights[c] == classWeights[best])
            {
                // Reservoir choice among the tied classes: each of the tied is kept with equal probability.
                tied++;
                if (generator.NextInt(tied) == 0) best = c;
            }
        }
        return best;
    }
}
