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
    private readonly double[] _classWeights;
    private readonly int[] _nodeClasses;
    private readonly double[] _impurityDecreases;

    /// <param name="missingCodes">Per node, the missing code (= value bin count) of its split feature.</param>
    /// <param name="classWeights">Per node, classCount weighted sample counts, node-major.</param>
    /// <param name="nodeClasses">Per node, the class a sample reaching it is given (the majority).</param>
    /// <param name="impurityDecreases">Per node, (W_t·G_t - W_L·G_L - W_R·G_R)/W_root; zero at leaves.</param>
    public DecisionTree(int classCount, int[] features, byte[] binThresholds, float[] thresholds, byte[] missingCodes,
        UnmeasuredRouting[] routing, int[] leftChildren, int[] rightChildren, double[] classWeights,
        int[] nodeClasses, double[] impurityDecreases, int[] sampleCounts)
        // The shape checks its own arrays (lengths, children after their parent).
        : this(classCount, new SplitTopology(features, binThresholds, thresholds, missingCodes, routing, leftChildren, rightChildren, sampleCounts),
            classWeights, nodeClasses, impurityDecreases)
    {
    }

    /// <summary>A tree from its shape and its per-node class values.</summary>
    public DecisionTree(int classCount, SplitTopology topology, double[] classWeights, int[] nodeClasses, double[] impurityDecreases)
    {
        ArgumentNullException.ThrowIfNull(topology);
        int nodeCount = topology.NodeCount;
        if (nodeClasses.Length != nodeCount || impurityDecreases.Length != nodeCount || classWeights.Length != nodeCount * classCount)
            throw new ArgumentException("Every node array must have one entry per node.");
        Topology = topology;
        ClassCount = classCount;
        _classWeights = classWeights;
        _nodeClasses = nodeClasses;
        _impurityDecreases = impurityDecreases;
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

    /// <summary>The tree's splits and children, shared in form with regression and survival trees.</summary>
    public SplitTopology Topology { get; }

    public int NodeCount => Topology.NodeCount;
    public int ClassCount { get; }

    /// <summary>Split feature of each node; -1 at leaves.</summary>
    public ReadOnlySpan<int> Features => Topology.Features;
    public ReadOnlySpan<byte> BinThresholds => Topology.BinThresholds;
    /// <summary>Split thresholds in the feature's original units.</summary>
    public ReadOnlySpan<float> Thresholds => Topology.Thresholds;
    public ReadOnlySpan<UnmeasuredRouting> Routing => Topology.Routing;
    public ReadOnlySpan<int> LeftChildren => Topology.LeftChildren;
    public ReadOnlySpan<int> RightChildren => Topology.RightChildren;
    /// <summary>Weighted class counts of every node, node-major (ClassCount per node).</summary>
    public ReadOnlySpan<double> ClassWeights => _classWeights;
    public ReadOnlySpan<int> NodeClasses => _nodeClasses;
    public ReadOnlySpan<double> ImpurityDecreases => _impurityDecreases;
    /// <summary>Distinct training samples that reached each node.</summary>
    public ReadOnlySpan<int> NodeSampleCounts => Topology.NodeSampleCounts;

    public bool IsLeaf(int node) => Topology.IsLeaf(node);

    public int SplitCount
    {
        get
        {
            int count = 0;
            foreach (int f in Topology.Features) if (f >= 0) count++;
            return count;
        }
    }

    /// <summary>The distinct features this tree splits on, in increasing order.</summary>
    public int[] SplitFeatures() => Topology.SplitFeatures();

    /// <summary>Whether a sample with this code of the node's feature goes to the left child.</summary>
    public bool GoesLeft(int node, byte code) => Topology.GoesLeft(node, code);

    /// <summary>The leaf a sample of a binned matrix reaches.</summary>
    public int LeafOf(BinnedMatrix matrix, int sample) => Topology.LeafOf(matrix, sample);

    /// <summary>
    /// The leaf a sample reaches when its code of one feature is replaced, without copying
    /// anything: what permutation importance needs to score a permuted feature.
    /// </summary>
    public int LeafOf(BinnedMatrix matrix, int sample, int replacedFeature, byte replacementCode) =>
        Topology.LeafOf(matrix, sample, replacedFeature, replacementCode);

    /// <summary>The leaf a sample of a raw matrix (same features as the training panel) reaches.</summary>
    public int LeafOf(FeatureMatrix matrix, int sample) => Topology.LeafOf(matrix, sample);

    public int PredictClass(BinnedMatrix matrix, int sample) => _nodeClasses[Topology.LeafOf(matrix, sample)];

    public int PredictClass(FeatureMatrix matrix, int sample) => _nodeClasses[Topology.LeafOf(matrix, sample)];

    /// <summary>Adds each feature's total weighted impurity decrease in this tree to totals.</summary>
    public void AddImpurityDecreases(Span<double> totals) => Topology.AddPerSplitFeature(_impurityDecreases, totals);
}
