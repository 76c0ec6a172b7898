using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Survival;

/// <summary>
/// Grows one survival tree at a time, depth first, splitting on the log-rank statistic (Segal
/// 1988; LeBlanc &amp; Crowley 1993; the random survival forests of Ishwaran et al. 2008) with a
/// random subset of features at each node. One builder per thread; buffers sized once.
/// </summary>
/// <remarks>
/// At a node with distinct event times t_1..t_m, at-risk weights Y_k and event weights d_k, a
/// split's statistic is |Σ_k (d_kL - Y_kL d_k/Y_k)| / sqrt(Σ_k (Y_kL/Y_k)(1 - Y_kL/Y_k)((Y_k - d_k)/(Y_k - 1)) d_k),
/// the standardised two-sample log-rank statistic of the left child (as ranger computes it;
/// Wright &amp; Ziegler 2017). Both sums are additive over the left child's rows once the node's
/// grid sums are known, except the variance's square term, which a Fenwick tree over the at-risk
/// counts keeps (see <see cref="LeftChildLogRank"/>): so a feature costs O(rows log m) whatever
/// its number of cut points, instead of O(codes x m). Weights are bootstrap counts (times sample
/// weights), i.e. a drawn row counts as often as it was drawn. Feature draws, stopping rules and unmeasured-cell routing follow the
/// classification builder.
/// </remarks>
internal sealed class SurvivalTreeBuilder
{
    private readonly FollowUpTimes _followUp;
    private readonly int[] _rows;
    private readonly double[] _weights;
    private readonly int[] _featureOrder;
    // Node-local event grid: global event-time indices present among the node's events, and per
    // row (parallel to the node's slice) its at-risk count and event index on that grid.
    private readonly int[] _grid;
    private readonly int[] _rowRisk;
    private readonly int[] _rowEvent;
    private readonly double[] _atRisk;   // Y_k, k < m
    private readonly double[] _deaths;   // d_k
    private readonly double[] _leftEnds; // weight by at-risk count q (0..m), while building the grid
    // Sums over the grid below q (0..m) and each row's additive terms (see PrepareRowTerms).
    private readonly double[] _cumulativeE;
    private readonly double[] _cumulativeA;
    private readonly double[] _cumulativeB;
    private readonly double[] _rowNumerator;
    private readonly double[] _rowLinear;
    private double _varianceFloor;
    private int _nodeStart;
    // The node's rows grouped by code of the feature being searched (local indices): _byCode holds
    // them ordered by code, and within a code by local index; group j (the codes present, increasing)
    // is _byCode[_groupStarts[j].._groupStarts[j + 1]). _codeCounts is all zero between groupings.
    private readonly int[] _codeCounts = new int[256];
    private readonly int[] _codeFill = new int[256];
    private readonly int[] _presentCodes = new int[256];
    private readonly int[] _groupStarts = new int[257];
    private readonly int[] _byCode;
    private readonly LeftChildLogRank _left;
    private int _valueEntryCount;
    private int _missingGroup;
    private int _belowGroup;
    private int _groupCount;
    private readonly Stack<(int Start, int End, int Depth, int Parent, bool IsLeft)> _pending = new();
    private readonly SurvivalTreeBuffer _buffer = new();

    public SurvivalTreeBuilder(FollowUpTimes followUp, int maxRows, int featureCount)
    {
        _followUp = followUp;
        _rows = new int[maxRows];
        _weights = new double[maxRows];
        _featureOrder = new int[featureCount];
        int maxEvents = Math.Max(1, followUp.EventTimes.Length);
        _grid = new int[maxRows];
        _rowRisk = new int[maxRows];
        _rowEvent = new int[maxRows];
        _atRisk = new double[maxEvents + 1];
        _deaths = new double[maxEvents + 1];
        _leftEnds = new double[maxEvents + 1];
        _cumulativeE = new double[maxEvents + 1];
        _cumulativeA = new double[maxEvents + 1];
        _cumulativeB = new double[maxEvents + 1];
        _rowNumerator = new double[maxRows];
        _rowLinear = new double[maxRows];
        _byCode = new int[maxRows];
        _left = new LeftChildLogRank(maxEvents + 1);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public SurvivalTree Grow(BinnedMatrix matrix, ReadOnlySpan<int> rows, ReadOnlySpan<double> weights, TreeOptions options,
        ref Xoshiro256StarStar generator)
    {
        int rowCount = rows.Length;
        rows.CopyTo(_rows);
        weights.CopyTo(_weights);
        int featureCount = matrix.FeatureCount;
        for (int f = 0; f < featureCount; f++) _featureOrder[f] = f;
        int featuresPerSplit = options.ResolveFeaturesPerSplit(featureCount);
        int globalEventCount = _followUp.EventTimes.Length;

        _buffer.Clear();
        _pending.Clear();
        _pending.Push((0, rowCount, 0, -1, false));
        while (_pending.Count > 0)
        {
            var (start, end, depth, parent, isLeft) = _pending.Pop();
            int nodeRows = end - start;
            int node = _buffer.Add(parent, isLeft, nodeRows);
            int m = BuildGrid(start, end);
            _buffer.SetMortality(node, Mortality(m, globalEventCount));

            var best = SplitCandidate.None;
            if (depth < options.MaxDepth && nodeRows >= 2 * options.MinLeafSize && nodeRows >= 2 && m > 0)
            {
                _nodeStart = start;
                best = FindSplit(matrix, start, end, m, featuresPerSplit, options.MinLeafSize, ref generator);
            }
            if (!best.IsFound || best.Score + 1e-12 < options.MinImpurityDecrease)
            {
                _buffer.SetLeafHazard(node, _grid.AsSpan(0, m), _deaths.AsSpan(0, m), _atRisk.AsSpan(0, m));
                continue;
            }
            var bins = matrix.Bins(best.Feature);
            int middle = RowPartition.Split(matrix.Codes(best.Feature), _rows, _weights, [], start, end,
                best.BinThreshold, bins.MissingCode, best.Routing);
            _buffer.SetSplit(node, best.Feature, best.BinThreshold, bins.UpperBound(best.BinThreshold), bins.MissingCode,
                best.Routing, best.Score);
            _pending.Push((middle, end, depth + 1, node, false));
            _pending.Push((start, middle, depth + 1, node, true));
        }
        return _buffer.ToTree();
    }

    /// <summary>
    /// The node's event grid (distinct event times among its rows), each row's place on it, and
    /// the node's at-risk and event weights per grid time; returns the grid's length m.
    /// </summary>
    private int BuildGrid(int start, int end)
    {
        var atRiskCounts = _followUp.AtRiskCounts;
        var eventIndices = _followUp.EventIndices;
        int m = 0;
        for (int i = start; i < end; i++)
        {
            int e = eventIndices[_rows[i]];
            if (e >= 0) _grid[m++] = e;
        }
        var grid = _grid.AsSpan(0, m);
        grid.Sort();
        int distinct = 0;
        for (int k = 0; k < grid.Length; k++)
            if (k == 0 || grid[k] != grid[k - 1]) grid[distinct++] = grid[k];
        m = distinct;
        grid = _grid.AsSpan(0, m);
        Array.Clear(_leftEnds, 0, m + 1);
        Array.Clear(_deaths, 0, m + 1);
        for (int i = start; i < end; i++)
        {
            int row = _rows[i];
            // At risk at grid times k < q: those whose global index is below the row's at-risk count.
            int at = grid.BinarySearch(atRiskCounts[row]);
            int q = at >= 0 ? at : ~at;
            int e = eventIndices[row];
            int k = e >= 0 ? grid.BinarySearch(e) : -1;
            _rowRisk[i - start] = q;
            _rowEvent[i - start] = k;
            _leftEnds[q] += _weights[i];
            if (k >= 0) _deaths[k] += _weights[i];
        }
        // Y_k = weight of rows with q > k.
        double running = 0;
        for (int k = m - 1; k >= 0; k--)
        {
            running += _leftEnds[k + 1];
            _atRisk[k] = running;
        }
        return m;
    }

    /// <summary>Σ over the training event times of this node's Nelson-Aalen hazard: Σ_k (d_k/Y_k)·(events at or after t_k).</summary>
    private double Mortality(int m, int globalEventCount)
    {
        double mortality = 0;
        for (int k = 0; k < m; k++)
            if (_atRisk[k] > 0) mortality += _deaths[k] / _atRisk[k] * (globalEventCount - _grid[k]);
        return mortality;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private SplitCandidate FindSplit(BinnedMatrix matrix, int start, int end, int m, int featuresPerSplit, int minLeafSize,
        ref Xoshiro256StarStar generator)
    {
        var best = SplitCandidate.None;
        var order = _featureOrder.AsSpan();
        PrepareRowTerms(start, end, m);
        int tried = 0;
        var rows = _rows.AsSpan(start, end - start);
        // Features drawn without replacement; a feature constant in the node is not counted. The
        // first k are drawn up front so that codes can be prefetched ahead of the search, and one
        // more per constant feature met: the same draws as one at a time (see TreeBuilder.FindSplit).
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
            GroupByCode(matrix.Codes(feature), start, end, valueBins);
            if (_groupCount <= 1) continue;
            tried++;
            Scan(feature, valueBins, m, end - start, minLeafSize, ref best);
        }
        return best;
    }

    /// <summary>
    /// Per node: the cumulative sums over the event grid that make the log-rank statistic of a
    /// left child additive over its rows. With e_k = d_k/Y_k and c_k = d_k (Y_k - d_k)/(Y_k - 1)
    /// (0 when Y_k &lt;= 1), and E, A, B the sums of e_k, c_k/Y_k, c_k/Y_k^2 over k &lt; q:
    /// numerator = Σ_{i in L} w_i ([event_i] - E(q_i)); variance = Σ_{i in L} w_i A(q_i) -
    /// Σ_{i,j in L} w_i w_j B(min(q_i, q_j)), since Y_kL = Σ_{i in L} w_i [k &lt; q_i].
    /// </summary>
    private void PrepareRowTerms(int start, int end, int m)
    {
        double e = 0, a = 0, b = 0, scale = 0;
        for (int k = 0; k < m; k++)
        {
            _cumulativeB[k] = b;
            double y = _atRisk[k], d = _deaths[k];
            _cumulativeE[k] = e;
            _cumulativeA[k] = a;
            if (y <= 0 || d <= 0) continue;
            e += d / y;
            if (y > 1)
            {
                double c = d * (y - d) / (y - 1);
                a += c / y;
                b += c / (y * y);
                scale += c;
            }
        }
        _cumulativeE[m] = e;
        _cumulativeA[m] = a;
        _cumulativeB[m] = b;
        // The variance is a difference of sums of up to Σ c_k; below this it is rounding, not information.
        _varianceFloor = 1e-12 * Math.Max(scale, 1e-300);
        for (int i = start; i < end; i++)
        {
            int local = i - start;
            int q = _rowRisk[local];
            double w = _weights[i];
            _rowNumerator[local] = w * ((_rowEvent[local] >= 0 ? 1.0 : 0.0) - _cumulativeE[q]);
            _rowLinear[local] = w * _cumulativeA[q];
        }
    }

    /// <summary>How many features ahead of the one being searched their codes are prefetched (as in TreeBuilder).</summary>
    private const int PrefetchDistance = 8;

    private static void Draw(Span<int> order, int position, ref Xoshiro256StarStar generator)
    {
        int pick = position + generator.NextInt(order.Length - position);
        (order[position], order[pick]) = (order[pick], order[position]);
    }

    /// <summary>
    /// Orders the node's rows (local indices) by code with a counting sort over the codes present
    /// only, so a node costs O(rows + codes present x log) per feature rather than O(bins): deep
    /// survival trees have many small nodes and up to 254 value bins per feature, and clearing and
    /// summing every bin's count made this grouping a quarter of a follow-up screen's time. The
    /// order (by code, then local index) is the one the split scan has always read, so every
    /// running sum, and every tree, is unchanged.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void GroupByCode(ReadOnlySpan<byte> codes, int start, int end, int valueBinCount)
    {
        var counts = _codeCounts.AsSpan();
        var present = _presentCodes.AsSpan();
        var rows = _rows.AsSpan(start, end - start);
        int presentCount = 0;
        foreach (int row in rows)
        {
            int code = codes[row];
            if (counts[code]++ == 0) present[presentCount++] = code;
        }
        var listed = present[..presentCount];
        // A few codes are sorted; many are read off the counts in order, which is then cheaper.
        if (presentCount * 8 < valueBinCount + 2) listed.Sort();
        else
        {
            int next = 0;
            for (int code = 0; code < valueBinCount + 2; code++)
                if (counts[code] > 0) present[next++] = code;
        }
        int offset = 0;
        _valueEntryCount = 0;
        _missingGroup = _belowGroup = -1;
        for (int j = 0; j < presentCount; j++)
        {
            int code = listed[j];
            _groupStarts[j] = offset;
            _codeFill[code] = offset;
            offset += counts[code];
            counts[code] = 0;
            if (code < valueBinCount) _valueEntryCount++;
            else if (code == valueBinCount) _missingGroup = j;
            else _belowGroup = j;
        }
        _groupStarts[presentCount] = offset;
        _groupCount = presentCount;
        var fill = _codeFill.AsSpan();
        for (int local = 0; local < rows.Length; local++) _byCode[fill[codes[rows[local]]]++] = local;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Scan(int feature, int valueBinCount, int m, int nodeRows, int minLeafSize, ref SplitCandidate best)
    {
        bool hasMissing = _missingGroup >= 0;
        bool hasBelow = _belowGroup >= 0;
        for (int combination = 0; combination < 4; combination++)
        {
            bool missingLeft = (combination & 1) != 0;
            bool belowLeft = (combination & 2) != 0;
            if ((missingLeft && !hasMissing) || (belowLeft && !hasBelow)) continue;
            _left.Reset(m);
            if (missingLeft) AddToLeft(_missingGroup);
            if (belowLeft) AddToLeft(_belowGroup);
            if (_valueEntryCount == 0)
            {
                // Only unmeasured cells here: the one split is missing versus below detection.
                if (combination == 1 && hasBelow)
                    Consider(feature, (byte)(valueBinCount - 1), nodeRows, minLeafSize, hasMissing, hasBelow, missingLeft, belowLeft, ref best);
                continue;
            }
            for (int j = 0; j < _valueEntryCount; j++)
            {
                // The left child only grows: once the right would be smaller than a leaf, no later
                // cut point can be taken, so the rest of the rows need not be added.
                if (nodeRows - (_left.Rows + (_groupStarts[j + 1] - _groupStarts[j])) < minLeafSize) break;
                AddToLeft(j);
                Consider(feature, (byte)_presentCodes[j], nodeRows, minLeafSize, hasMissing, hasBelow, missingLeft, belowLeft, ref best);
            }
        }
    }

    /// <summary>Moves one group's rows into the left child, updating its running numerator and variance.</summary>
    private void AddToLeft(int group)
    {
        for (int at = _groupStarts[group]; at < _groupStarts[group + 1]; at++)
        {
            int local = _byCode[at];
            _left.Add(_rowRisk[local], _weights[local + _nodeStart], _rowNumerator[local], _rowLinear[local], _cumulativeB);
        }
    }

    /// <summary>Scores the split whose left child holds the rows added so far; keeps it when strictly better.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void Consider(int feature, byte binThreshold, int nodeRows, int minLeafSize,
        bool hasMissing, bool hasBelow, bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        double leftRows = _left.Rows;
        double rightRows = nodeRows - leftRows;
        if (leftRows < minLeafSize || rightRows < minLeafSize) return;
        double variance = _left.Variance;
        if (!(variance > _varianceFloor)) return;
        // Most cut points fall well short of the best so far: |N|/sqrt(V) < S exactly when
        // N^2 < S^2 V, and with a margin of 1e-9, far above the rounding of either side, this
        // rejects only what the exact comparison below would reject, without its root and division.
        double bestScore = best.Score;
        if (bestScore > 0 && bestScore < 1e100)
        {
            double numerator = _left.Numerator;
            if (numerator * numerator < bestScore * bestScore * variance * (1 - 1e-9)) return;
        }
        double score = Math.Abs(_left.Numerator) / Math.Sqrt(variance);
        if (!(score > best.Score)) return;
        best = SplitScanner.Record(feature, binThreshold, score, leftRows, rightRows, hasMissing, hasBelow, missingLeft, belowLeft);
    }
}

/// <summary>
/// The running log-rank numerator and variance of a left child as rows are added to it, with
/// two Fenwick trees over the at-risk count q (Fenwick 1994): one of w_j B(q_j), one of w_j, so
/// that Σ_{j in L} w_j B(min(q, q_j)) costs O(log m) per added row. The two trees share one
/// array, entry i's pair side by side, so that one walk reads and updates both: the sums are
/// taken in the same order as with two arrays.
/// </summary>
internal sealed class LeftChildLogRank(int capacity)
{
    // [2i] = node i of the tree of w_j B(q_j), [2i + 1] = node i of the tree of w_j.
    private readonly double[] _trees = new double[2 * (capacity + 2)];
    private int _size;
    private double _totalWeight;
    private double _linear;
    private double _quadratic;

    public double Rows { get; private set; }
    public double Numerator { get; private set; }
    public double Variance => _linear - _quadratic;

    public void Reset(int m)
    {
        _size = m + 1;
        Array.Clear(_trees, 0, 2 * (_size + 1));
        _totalWeight = _linear = _quadratic = 0;
        Rows = Numerator = 0;
    }

    /// <summary>Adds a row with at-risk count q, weight w and its additive terms; b holds B(q) for q = 0..m.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void Add(int q, double w, double numerator, double linear, double[] b)
    {
        // Σ_{j in L} w_j B(min(q, q_j)) = Σ_{q_j <= q} w_j B(q_j) + B(q) Σ_{q_j > q} w_j.
        var trees = _trees;
        double below = 0, weightBelow = 0;
        for (int i = q + 1; i > 0; i -= i & -i)
        {
            below += trees[2 * i];
            weightBelow += trees[2 * i + 1];
        }
        double bq = b[q];
        double cross = below + bq * (_totalWeight - weightBelow);
        _quadratic += 2 * w * cross + w * w * bq;
        _linear += linear;
        Numerator += numerator;
        Rows += 1;
        _totalWeight += w;
        double weightedB = w * bq;
        for (int i = q + 1; i <= _size; i += i & -i)
        {
            trees[2 * i] += weightedB;
            trees[2 * i + 1] += w;
        }
    }
}

/// <summary>A <see cref="SplitTopologyBuffer"/> with each node's mortality, split statistic and leaf hazard, reused across trees.</summary>
internal sealed class SurvivalTreeBuffer
{
    private readonly SplitTopologyBuffer _topology = new();
    private double[] _mortality = new double[64];
    private double[] _statistics = new double[64];
    private int[] _hazardStarts = new int[64];
    private int[] _hazardCounts = new int[64];
    private readonly List<int> _hazardTimes = [];
    private readonly List<double> _hazards = [];

    public void Clear()
    {
        _topology.Clear();
        _hazardTimes.Clear();
        _hazards.Clear();
    }

    public int Add(int parent, bool isLeft, int sampleCount)
    {
        int node = _topology.Add(parent, isLeft, sampleCount);
        if (_mortality.Length < _topology.Capacity)
        {
            int size = _topology.Capacity;
            Array.Resize(ref _mortality, size);
            Array.Resize(ref _statistics, size);
            Array.Resize(ref _hazardStarts, size);
            Array.Resize(ref _hazardCounts, size);
        }
        _statistics[node] = 0;
        _hazardStarts[node] = _hazardTimes.Count;
        _hazardCounts[node] = 0;
        return node;
    }

    public void SetMortality(int node, double mortality) => _mortality[node] = mortality;

    /// <summary>Stores a leaf's Nelson-Aalen steps: at each grid time, the hazard summed up to it.</summary>
    public void SetLeafHazard(int node, ReadOnlySpan<int> grid, ReadOnlySpan<double> deaths, ReadOnlySpan<double> atRisk)
    {
        _hazardStarts[node] = _hazardTimes.Count;
        double hazard = 0;
        for (int k = 0; k < grid.Length; k++)
        {
            if (atRisk[k] <= 0 || deaths[k] <= 0) continue;
            hazard += deaths[k] / atRisk[k];
            _hazardTimes.Add(grid[k]);
            _hazards.Add(hazard);
        }
        _hazardCounts[node] = _hazardTimes.Count - _hazardStarts[node];
    }

    public void SetSplit(int node, int feature, byte binThreshold, float threshold, byte missingCode,
        UnmeasuredRouting routing, double statistic)
    {
        _topology.SetSplit(node, feature, binThreshold, threshold, missingCode, routing);
        _statistics[node] = statistic;
    }

    public SurvivalTree ToTree()
    {
        int count = _topology.Count;
        return new(_topology.ToTopology(), _mortality[..count], _statistics[..count], _hazardStarts[..count],
            _hazardCounts[..count], _hazardTimes.ToArray(), _hazards.ToArray());
    }
}
