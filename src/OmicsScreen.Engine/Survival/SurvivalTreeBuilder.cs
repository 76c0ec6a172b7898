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
/// Wright &amp; Ziegler 2017). Per feature the node's rows are counted by code into at-risk and event
/// weights per event time, so every cut point is scored in O(m) from running sums: O(rows + codes·m)
/// per feature. Weights are bootstrap counts (times sample weights), i.e. a drawn row counts as
/// often as it was drawn. Feature draws, stopping rules and unmeasured-cell routing follow the
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
    private readonly double[] _leftEnds; // left child's weight by at-risk count q (0..m)
    private readonly double[] _leftDeaths;
    // Per code: weights by at-risk count q (m + 1), event weights by k (m), row count (1).
    private readonly double[] _codeSums;
    private readonly byte[] _valueCodes = new byte[256];
    private readonly bool[] _codeHit = new bool[258];
    private readonly byte[] _hitCodes = new byte[258];
    private int _hitCount;
    private int _stride;
    private int _valueEntryCount;
    private int _missingCode;
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
        _leftDeaths = new double[maxEvents + 1];
        _codeSums = new double[258 * (2 * maxEvents + 2)];
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
                best = FindSplit(matrix, start, end, m, featuresPerSplit, options.MinLeafSize, ref generator);
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
        _stride = 2 * m + 2;
        int tried = 0;
        // Features drawn one at a time without replacement; a feature constant in the node is not counted.
        for (int next = 0; next < order.Length && tried < featuresPerSplit; next++)
        {
            int pick = next + generator.NextInt(order.Length - next);
            (order[next], order[pick]) = (order[pick], order[next]);
            int feature = order[next];
            int valueBins = matrix.ValueBinCount(feature);
            Fill(matrix.Codes(feature), start, end, m, valueBins);
            int groups = _valueEntryCount + (RowsOf(_missingCode) > 0 ? 1 : 0) + (RowsOf(_missingCode + 1) > 0 ? 1 : 0);
            if (groups <= 1) continue;
            tried++;
            Scan(feature, valueBins, m, end - start, minLeafSize, ref best);
        }
        return best;
    }

    /// <summary>Rows of the node with this code in the last fill (the count sits last in the code's entry).</summary>
    private double RowsOf(int code) => _codeHit[code] ? _codeSums[code * _stride + _stride - 1] : 0;

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Fill(ReadOnlySpan<byte> codes, int start, int end, int m, int valueBinCount)
    {
        // Clear what the previous fill touched (its stride may differ: it may be another node's).
        for (int j = 0; j < _hitCount; j++)
        {
            int code = _hitCodes[j];
            _codeHit[code] = false;
        }
        _hitCount = 0;
        _missingCode = valueBinCount;
        int stride = _stride;
        var sums = _codeSums.AsSpan();
        for (int i = start; i < end; i++)
        {
            int code = codes[_rows[i]];
            int at = code * stride;
            if (!_codeHit[code])
            {
                _codeHit[code] = true;
                _hitCodes[_hitCount++] = (byte)code;
                sums.Slice(at, stride).Clear();
            }
            double w = _weights[i];
            sums[at + _rowRisk[i - start]] += w;
            int k = _rowEvent[i - start];
            if (k >= 0) sums[at + m + 1 + k] += w;
            sums[at + 2 * m + 1] += 1;
        }
        int listed = 0;
        for (int code = 0; code < valueBinCount; code++)
            if (_codeHit[code]) _valueCodes[listed++] = (byte)code;
        _valueEntryCount = listed;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Scan(int feature, int valueBinCount, int m, int nodeRows, int minLeafSize, ref SplitCandidate best)
    {
        bool hasMissing = _codeHit[_missingCode];
        bool hasBelow = _codeHit[_missingCode + 1];
        for (int combination = 0; combination < 4; combination++)
        {
            bool missingLeft = (combination & 1) != 0;
            bool belowLeft = (combination & 2) != 0;
            if ((missingLeft && !hasMissing) || (belowLeft && !hasBelow)) continue;
            Array.Clear(_leftEnds, 0, m + 1);
            Array.Clear(_leftDeaths, 0, m + 1);
            double leftRows = 0;
            if (missingLeft) leftRows += AddToLeft(_missingCode, m);
            if (belowLeft) leftRows += AddToLeft(_missingCode + 1, m);
            if (_valueEntryCount == 0)
            {
                // Only unmeasured cells here: the one split is missing versus below detection.
                if (combination == 1 && hasBelow)
                    Consider(feature, (byte)(valueBinCount - 1), leftRows, m, nodeRows, minLeafSize, hasMissing, hasBelow,
                        missingLeft, belowLeft, ref best);
                continue;
            }
            for (int j = 0; j < _valueEntryCount; j++)
            {
                leftRows += AddToLeft(_valueCodes[j], m);
                Consider(feature, _valueCodes[j], leftRows, m, nodeRows, minLeafSize, hasMissing, hasBelow,
                    missingLeft, belowLeft, ref best);
            }
        }
    }

    private double AddToLeft(int code, int m)
    {
        int at = code * _stride;
        var sums = _codeSums.AsSpan(at, _stride);
        for (int q = 0; q <= m; q++) _leftEnds[q] += sums[q];
        for (int k = 0; k < m; k++) _leftDeaths[k] += sums[m + 1 + k];
        return sums[2 * m + 1];
    }

    /// <summary>Scores the split whose left child holds the accumulated codes; keeps it when strictly better.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Consider(int feature, byte binThreshold, double leftRows, int m, int nodeRows, int minLeafSize,
        bool hasMissing, bool hasBelow, bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        double rightRows = nodeRows - leftRows;
        if (leftRows < minLeafSize || rightRows < minLeafSize) return;
        double numerator = 0, variance = 0, leftAtRisk = 0;
        for (int k = m - 1; k >= 0; k--)
        {
            leftAtRisk += _leftEnds[k + 1];
            double y = _atRisk[k], d = _deaths[k];
            if (y <= 0 || d <= 0) continue;
            double share = leftAtRisk / y;
            numerator += _leftDeaths[k] - share * d;
            if (y > 1) variance += share * (1 - share) * ((y - d) / (y - 1)) * d;
        }
        if (!(variance > 0)) return;
        double score = Math.Abs(numerator) / Math.Sqrt(variance);
        if (!(score > best.Score)) return;
        best = SplitScanner.Record(feature, binThreshold, score, leftRows, rightRows, hasMissing, hasBelow, missingLeft, belowLeft);
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
