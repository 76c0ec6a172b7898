using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Regression;

/// <summary>
/// A grown regression tree: its <see cref="SplitTopology"/> and, per node, the weighted mean of
/// the outcome over its in-bag samples, which is the prediction at a leaf (CART; Breiman et al.
/// 1984, ch. 8), and the weighted variance decrease of its split.
/// </summary>
public sealed class RegressionTree
{
    private readonly double[] _nodeMeans;
    private readonly double[] _impurityDecreases;

    /// <param name="impurityDecreases">Per node, (W_t·V_t - W_L·V_L - W_R·V_R)/W_root with V the weighted variance; zero at leaves.</param>
    public RegressionTree(SplitTopology topology, double[] nodeMeans, double[] impurityDecreases)
    {
        ArgumentNullException.ThrowIfNull(topology);
        if (nodeMeans.Length != topology.NodeCount || impurityDecreases.Length != topology.NodeCount)
            throw new ArgumentException("Every node array must have one entry per node.");
        Topology = topology;
        _nodeMeans = nodeMeans;
        _impurityDecreases = impurityDecreases;
    }

    public SplitTopology Topology { get; }
    /// <summary>Weighted mean outcome of each node's in-bag samples; the prediction at leaves.</summary>
    public ReadOnlySpan<double> NodeMeans => _nodeMeans;
    public ReadOnlySpan<double> ImpurityDecreases => _impurityDecreases;

    public double Predict(BinnedMatrix matrix, int sample) => _nodeMeans[Topology.LeafOf(matrix, sample)];

    public double Predict(FeatureMatrix matrix, int sample) => _nodeMeans[Topology.LeafOf(matrix, sample)];

    /// <summary>Adds each feature's total weighted variance decrease in this tree to totals.</summary>
    public void AddImpurityDecreases(Span<double> totals) => Topology.AddPerSplitFeature(_impurityDecreases, totals);
}
