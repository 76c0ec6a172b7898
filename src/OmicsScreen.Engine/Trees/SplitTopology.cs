using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The shape of a grown tree, whatever its outcome: per node its split (feature, bin and raw
/// threshold, unmeasured-cell routing), its children and the distinct training samples that
/// reached it, stored flat with node 0 the root and leaves at feature -1. Regression and survival
/// trees keep their node values beside it; routing a sample is the same for all of them.
/// </summary>
public sealed class SplitTopology
{
    private readonly int[] _features;
    private readonly byte[] _binThresholds;
    private readonly float[] _thresholds;
    private readonly byte[] _missingCodes;
    private readonly UnmeasuredRouting[] _routing;
    private readonly int[] _leftChildren;
    private readonly int[] _rightChildren;
    private readonly int[] _sampleCounts;

    public SplitTopology(int[] features, byte[] binThresholds, float[] thresholds, byte[] missingCodes,
        UnmeasuredRouting[] routing, int[] leftChildren, int[] rightChildren, int[] sampleCounts)
    {
        int nodeCount = features.Length;
        if (nodeCount < 1) throw new ArgumentException("A tree has at least a root.");
        if (binThresholds.Length != nodeCount || thresholds.Length != nodeCount || missingCodes.Length != nodeCount
            || routing.Length != nodeCount || leftChildren.Length != nodeCount || rightChildren.Length != nodeCount
            || sampleCounts.Length != nodeCount)
            throw new ArgumentException("Every node array must have one entry per node.");
        for (int node = 0; node < nodeCount; node++)
            if (features[node] >= 0 && ((uint)leftChildren[node] >= (uint)nodeCount || (uint)rightChildren[node] >= (uint)nodeCount
                || leftChildren[node] <= node || rightChildren[node] <= node))
                throw new ArgumentException($"Node {node} has a child out of range.");
        _features = features;
        _binThresholds = binThresholds;
        _thresholds = thresholds;
        _missingCodes = missingCodes;
        _routing = routing;
        _leftChildren = leftChildren;
        _rightChildren = rightChildren;
        _sampleCounts = sampleCounts;
    }

    public int NodeCount => _features.Length;

    /// <summary>Split feature of each node; -1 at leaves.</summary>
    public ReadOnlySpan<int> Features => _features;
    public ReadOnlySpan<byte> BinThresholds => _binThresholds;
    /// <summary>Split thresholds in the feature's original units.</summary>
    public ReadOnlySpan<float> Thresholds => _thresholds;
    public ReadOnlySpan<UnmeasuredRouting> Routing => _routing;
    public ReadOnlySpan<int> LeftChildren => _leftChildren;
    public ReadOnlySpan<int> RightChildren => _rightChildren;
    /// <summary>Distinct training samples that reached each node.</summary>
    public ReadOnlySpan<int> NodeSampleCounts => _sampleCounts;

    public bool IsLeaf(int node) => _features[node] < 0;

    /// <summary>The distinct features the tree splits on, in increasing order.</summary>
    public int[] SplitFeatures()
    {
        var used = new SortedSet<int>();
        foreach (int f in _features) if (f >= 0) used.Add(f);
        return used.ToArray();
    }

    /// <summary>Whether a sample with this code of the node's feature goes to the left child.</summary>
    public bool GoesLeft(int node, byte code) =>
        BranchRule.GoesLeft(code, _binThresholds[node], _missingCodes[node], _routing[node]);

    /// <summary>The leaf a sample of a binned matrix reaches.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public int LeafOf(BinnedMatrix matrix, int sample)
    {
        int node = 0;
        while (_features[node] >= 0)
            node = GoesLeft(node, matrix.Codes(_features[node])[sample]) ? _leftChildren[node] : _rightChildren[node];
        return node;
    }

    /// <summary>The leaf a sample reaches when its code of one feature is replaced (permutation importance).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public int LeafOf(BinnedMatrix matrix, int sample, int replacedFeature, byte replacementCode)
    {
        int node = 0;
        while (_features[node] >= 0)
        {
            int feature = _features[node];
            byte code = feature == replacedFeature ? replacementCode : matrix.Codes(feature)[sample];
            node = GoesLeft(node, code) ? _leftChildren[node] : _rightChildren[node];
        }
        return node;
    }

    /// <summary>The leaf a sample of a raw matrix (same features as the training panel) reaches.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public int LeafOf(FeatureMatrix matrix, int sample)
    {
        int node = 0;
        while (_features[node] >= 0)
        {
            int feature = _features[node];
            var state = matrix.State(feature, sample);
            float value = matrix.Value(feature, sample);
            bool left;
            if (state == CellState.BelowDetection) left = (_routing[node] & UnmeasuredRouting.BelowDetectionLeft) != 0;
            else if (state == CellState.Missing || float.IsNaN(value)) left = (_routing[node] & UnmeasuredRouting.MissingLeft) != 0;
            else left = value <= _thresholds[node];
            node = left ? _leftChildren[node] : _rightChildren[node];
        }
        return node;
    }

    /// <summary>Adds, for each feature, the node values of the nodes that split on it.</summary>
    public void AddPerSplitFeature(ReadOnlySpan<double> nodeValues, Span<double> totals)
    {
        for (int node = 0; node < _features.Length; node++)
            if (_features[node] >= 0) totals[_features[node]] += nodeValues[node];
    }
}

/// <summary>
/// Growable topology arrays reused by a builder across trees, depth-first node order; copied once
/// into an exactly sized <see cref="SplitTopology"/> when a tree is finished. Builders keep their
/// own node values in parallel arrays and grow them when <see cref="Add"/> reports a new capacity.
/// </summary>
internal sealed class SplitTopologyBuffer
{
    private int[] _features = new int[64];
    private byte[] _binThresholds = new byte[64];
    private float[] _thresholds = new float[64];
    private byte[] _missingCodes = new byte[64];
    private UnmeasuredRouting[] _routing = new UnmeasuredRouting[64];
    private int[] _left = new int[64];
    private int[] _right = new int[64];
    private int[] _sampleCounts = new int[64];

    public int Count { get; private set; }

    /// <summary>Room for this many nodes before the arrays grow.</summary>
    public int Capacity => _features.Length;

    public void Clear() => Count = 0;

    /// <summary>Appends a leaf reached by sampleCount samples and links it to its parent; returns its index.</summary>
    public int Add(int parent, bool isLeft, int sampleCount)
    {
        if (Count == _features.Length) Grow();
        int node = Count++;
        _features[node] = -1;
        _binThresholds[node] = 0;
        _thresholds[node] = float.NaN;
        _missingCodes[node] = 0;
        _routing[node] = UnmeasuredRouting.BothRight;
        _left[node] = -1;
        _right[node] = -1;
        _sampleCounts[node] = sampleCount;
        if (parent >= 0)
        {
            if (isLeft) _left[parent] = node;
            else _right[parent] = node;
        }
        return node;
    }

    public void SetSplit(int node, int feature, byte binThreshold, float threshold, byte missingCode, UnmeasuredRouting routing)
    {
        _features[node] = feature;
        _binThresholds[node] = binThreshold;
        _thresholds[node] = threshold;
        _missingCodes[node] = missingCode;
        _routing[node] = routing;
    }

    public SplitTopology ToTopology() => new(_features[..Count], _binThresholds[..Count], _thresholds[..Count],
        _missingCodes[..Count], _routing[..Count], _left[..Count], _right[..Count], _sampleCounts[..Count]);

    private void Grow()
    {
        int size = _features.Length * 2;
        Array.Resize(ref _features, size);
        Array.Resize(ref _binThresholds, size);
        Array.Resize(ref _thresholds, size);
        Array.Resize(ref _missingCodes, size);
        Array.Resize(ref _routing, size);
        Array.Resize(ref _left, size);
        Array.Resize(ref _right, size);
        Array.Resize(ref _sampleCounts, size);
    }
}

/// <summary>The in-place partition of a node's row slice that every builder uses.</summary>
internal static class RowPartition
{
    /// <summary>
    /// Moves the rows going left to the front of rows[start..end), swapping the parallel weights
    /// (and values, when given) with them; returns where the right child starts.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static int Split(ReadOnlySpan<byte> codes, Span<int> rows, Span<double> weights, Span<double> values,
        int start, int end, byte binThreshold, byte missingCode, UnmeasuredRouting routing)
    {
        bool carryValues = !values.IsEmpty;
        int low = start, high = end - 1;
        // Invariant: rows before low go left, rows after high go right.
        while (low <= high)
        {
            if (BranchRule.GoesLeft(codes[rows[low]], binThreshold, missingCode, routing)) { low++; continue; }
            (rows[low], rows[high]) = (rows[high], rows[low]);
            (weights[low], weights[high]) = (weights[high], weights[low]);
            if (carryValues) (values[low], values[high]) = (values[high], values[low]);
            high--;
        }
        return low;
    }
}
