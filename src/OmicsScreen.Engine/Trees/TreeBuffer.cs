namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The class builder's node buffer: a <see cref="SplitTopologyBuffer"/> with each node's class
/// weights, class and impurity decrease, reused by a <see cref="TreeBuilder"/> across trees and
/// copied once into an exactly sized <see cref="DecisionTree"/> when a tree is finished.
/// </summary>
internal sealed class TreeBuffer
{
    private readonly int _classCount;
    private readonly SplitTopologyBuffer _topology = new();
    private double[] _classWeights;
    private int[] _nodeClasses = new int[64];
    private double[] _decreases = new double[64];

    public TreeBuffer(int classCount)
    {
        _classCount = classCount;
        _classWeights = new double[64 * classCount];
    }

    public void Clear() => _topology.Clear();

    /// <summary>Appends a leaf reached by sampleCount samples and links it to its parent; returns its index.</summary>
    public int Add(int parent, bool isLeft, int sampleCount)
    {
        int node = _topology.Add(parent, isLeft, sampleCount);
        if (_nodeClasses.Length < _topology.Capacity)
        {
            int size = _topology.Capacity;
            Array.Resize(ref _classWeights, size * _classCount);
            Array.Resize(ref _nodeClasses, size);
            Array.Resize(ref _decreases, size);
        }
        _decreases[node] = 0;
        return node;
    }

    public void SetNode(int node, ReadOnlySpan<double> classWeights, int nodeClass)
    {
        classWeights.CopyTo(_classWeights.AsSpan(node * _classCount, _classCount));
        _nodeClasses[node] = nodeClass;
    }

    public void SetSplit(int node, int feature, byte binThreshold, float threshold, byte missingCode,
        UnmeasuredRouting routing, double decrease)
    {
        _topology.SetSplit(node, feature, binThreshold, threshold, missingCode, routing);
        _decreases[node] = decrease;
    }

    public DecisionTree ToTree()
    {
        int count = _topology.Count;
        return new(_classCount, _topology.ToTopology(), _classWeights[..(count * _classCount)], _nodeClasses[..count], _decreases[..count]);
    }
}
