using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Regression;

/// <summary>
/// A grown regression tree stored flat, node 0 the root; each node holds the weighted mean of
/// the outcome over its in-bag samples, which is the prediction at a leaf (CART; Breiman et al.
/// 1984, ch. 8).
/// </summary>
/// <remarks>
/// Same branch rule as <see cref="DecisionTree"/> (<see cref="BranchRule"/>): a code at most
/// <see cref="BinThresholds"/> goes left; missing and below-detection cells follow <see cref="Routing"/>.
/// A leaf has feature -1.
/// </remarks>
public sealed class RegressionTree
{
    private readonly int[] _features;
    private readonly byte[] _binThresholds;
    private readonly float[] _thresholds;
    private readonly byte[] _missingCodes;
    private readonly UnmeasuredRouting[] _routing;
    private readonly int[] _leftChildren;
    private readonly int[] _rightChildren;
    private readonly double[] _nodeMeans;
    private readonly double[] _impurityDecreases;
    private readonly int[] _sampleCounts;

    /// <param name="impurityDecreases">Per node, (W_t·V_t - W_L·V_L - W_R·V_R)/W_root with V the weighted variance; zero at leaves.</param>
    public RegressionTree(int[] features, byte[] binThresholds, float[] thresholds, byte[] missingCodes,
        UnmeasuredRouting[] routing, int[] leftChildren, int[] rightChildren, double[] nodeMeans,
        double[] impurityDecreases, int[] sampleCounts)
    {
        int nodeCount = features.Length;
        if (nodeCount < 1) throw new ArgumentException("A tree has at least a root.");
        if (binThresholds.Length != nodeCount || thresholds.Length != nodeCount || missingCodes.Length != nodeCount
            || routing.Length != nodeCount || leftChildren.Length != nodeCount || rightChildren.Length != nodeCount
            || nodeMeans.Length != nodeCount || impurityDecreases.Length != nodeCount || sampleCounts.Length != nodeCount)
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
        _nodeMeans = nodeMeans;
        _impurityDecreases = impurityDecreases;
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
    /// <summary>Weighted mean outcome of each node's in-bag samples; the prediction at leaves.</summary>
    public ReadOnlySpan<double> NodeMeans => _nodeMeans;
    public ReadOnlySpan<double> ImpurityDecreases => _impurityDecreases;
    /// <summary>Distinct training samples that reached each node.</summary>
    public ReadOnlySpan<int> NodeSampleCounts => _sampleCounts;

    public bool IsLeaf(int node) => _features[node] < 0;

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

    public double Predict(BinnedMatrix matrix, int sample) => _nodeMeans[LeafOf(matrix, sample)];

    public double Predict(FeatureMatrix matrix, int sample) => _nodeMeans[LeafOf(matrix, sample)];

    /// <summary>Adds each feature's total weighted variance decrease in this tree to totals.</summary>
    public void AddImpurityDecreases(Span<double> totals)
    {
        for (int node = 0; node < _features.Length; node++)
            if (_features[node] >= 0) totals[_features[node]] += _impurityDecreases[node];
    }
}
