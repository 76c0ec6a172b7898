using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// A grown classification tree stored flat: one entry per node in parallel arrays, node 0 the
/// root. It only stores and answers; growing is <see cref="TreeBuilder"/>'s job, and importances
/// are computed from the stored nodes, so they can be checked on hand-built trees.
/// </summary>
/// <remarks>
/// At an internal node, a sample goes left when its value code is at most
/// <see cref="BinThresholds"/> (equivalently its raw value is at most <see cref="Thresholds"/>);
/// a missing or below-detection cell goes where <see cref="Routing"/> says. A leaf has feature -1.
/// </remarks>
public sealed class DecisionTree
{
    private readonly int[] _features;
    private readonly byte[] _binThresholds;
    private readonly float[] _thresholds;
    private readonly byte[] _missingCodes;
    private readonly UnmeasuredRouting[] _routing;
    private readonly int[] _leftChildren;
    private readonly int[] _rightChildren;
    private readonly double[] _classWeights;
    private readonly int[] _nodeClasses;
    private readonly double[] _impurityDecreases;
    private readonly int[] _sampleCounts;

    /// <param name="missingCodes">Per node, the missing code (= value bin count) of its split feature.</param>
    /// <param name="classWeights">Per node, classCount weighted sample counts, node-major.</param>
    /// <param name="nodeClasses">Per node, the class a sample reaching it is given (the majority).</param>
    /// <param name="impurityDecreases">Per node, (W_t·G_t - W_L·G_L - W_R·G_R)/W_root; zero at leaves.</param>
    public DecisionTree(int classCount, int[] features, byte[] binThresholds, float[] thresholds, byte[] missingCodes,
        UnmeasuredRouting[] routing, int[] leftChildren, int[] rightChildren, double[] classWeights,
        int[] nodeClasses, double[] impurityDecreases, int[] sampleCounts)
    {
        int nodeCount = features.Length;
        if (nodeCount < 1) throw new ArgumentException("A tree has at least a root.");
        if (binThresholds.Length != nodeCount || thresholds.Length != nodeCount || missingCodes.Length != nodeCount
            || routing.Length != nodeCount || leftChildren.Length != nodeCount || rightChildren.Length != nodeCount
            || nodeClasses.Length != nodeCount || impurityDecreases.Length != nodeCount || sampleCounts.Length != nodeCount
            || classWeights.Length != nodeCount * classCount)
            throw new ArgumentException("Every node array must have one entry per node.");
        for (int node = 0; node < nodeCount; node++)
            if (features[node] >= 0 && ((uint)leftChildren[node] >= (uint)nodeCount || (uint)rightChildren[node] >= (uint)nodeCount
                || leftChildren[node] <= node || rightChildren[node] <= node))
                throw new ArgumentException($"Node {node} has a child out of range.");
        ClassCount = classCount;
        _features = features;
        _binThresholds = binThresholds;
        _thresholds = thresholds;
        _missingCodes = missingCodes;
        _routing = routing;
        _leftChildren = leftChildren;
        _rightChildren = rightChildren;
        _classWeights = classWeights;
        _nodeClasses = nodeClasses;
        _impurityDecreases = impurityDecreases;
        _sampleCounts = sampleCounts;
    }

    /// <summary>The parallel node arrays a tree holds, each an object with its own header.</summary>
    public const int NodeArrayCount = 11;

    /// <summary>
    /// Bytes one node takes across the node arrays: feature, bin threshold, threshold, missing
    /// code, routing (one byte), two children, class, impurity decrease, sample count, and one
    /// weight per class. Memory estimates ask this rather than copy the layout.
    /// </summary>
    public static int BytesPerNode(int classCount) =>
        sizeof(int) + sizeof(byte) + sizeof(float) + sizeof(byte) + sizeof(byte) + 2 * sizeof(int) + sizeof(int)
        + sizeof(double) + sizeof(int) + classCount * sizeof(double);

    public int NodeCount => _features.Length;
    public int ClassCount { get; }

    /// <summary>Split feature of each node; -1 at leaves.</summary>
    public ReadOnlySpan<int> Features => _features;
    public ReadOnlySpan<byte> BinThresholds => _binThresholds;
    /// <summary>Split thresholds in the feature's original units.</summary>
    public ReadOnlySpan<float> Thresholds => _thresholds;
    public ReadOnlySpan<UnmeasuredRouting> Routing => _routing;
    public ReadOnlySpan<int> LeftChildren => _leftChildren;
    public ReadOnlySpan<int> RightChildren => _rightChildren;
    /// <summary>Weighted class counts of every node, node-major (ClassCount per node).</summary>
    public ReadOnlySpan<double> ClassWeights => _classWeights;
    public ReadOnlySpan<int> NodeClasses => _nodeClasses;
    public ReadOnlySpan<double> ImpurityDecreases => _impurityDecreases;
    /// <summary>Distinct training samples that reached each node.</summary>
    public ReadOnlySpan<int> NodeSampleCounts => _sampleCounts;

    public bool IsLeaf(int node) => _features[node] < 0;

    public int SplitCount
    {
        get
        {
            int count = 0;
            foreach (int f in _features) if (f >= 0) count++;
            return count;
        }
    }

    /// <summary>The distinct features this tree splits on, in increasing order.</summary>
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
        {
            byte code = matrix.Codes(_features[node])[sample];
            node = GoesLeft(node, code) ? _leftChildren[node] : _rightChildren[node];
        }
        return node;
    }

    /// <summary>
    /// The leaf a sample reaches when its code of one feature is replaced, without copying
    /// anything: what permutation importance needs to score a permuted feature.
    /// </summary>
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

    public int PredictClass(BinnedMatrix matrix, int sample) => _nodeClasses[LeafOf(matrix, sample)];

    public int PredictClass(FeatureMatrix matrix, int sample) => _nodeClasses[LeafOf(matrix, sample)];

    /// <summary>Adds each feature's total weighted impurity decrease in this tree to totals.</summary>
    public void AddImpurityDecreases(Span<double> totals)
    {
        for (int node = 0; node < _features.Length; node++)
            if (_features[node] >= 0) totals[_features[node]] += _impurityDecreases[node];
    }
}
