namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The builder's node buffer: growable node arrays reused by a <see cref="TreeBuilder"/> across
/// trees, copied once into an exactly sized <see cref="DecisionTree"/> when a tree is finished.
/// </summary>
internal sealed class TreeBuffer
{
    private readonly int _classCount;
    private int _count;
    private int[] _features = new int[64];
    private byte[] _binThresholds = new byte[64];
    private float[] _thresholds = new float[64];
    private byte[] _missingCodes = new byte[64];
    private UnmeasuredRouting[] _routing = new UnmeasuredRouting[64];
    private int[] _left = new int[64];
    private int[] _right = new int[64];
    private double[] _classWeights;
    private int[] _nodeClasses = new int[64];
    private double[] _decreases = new double[64];
    private int[] _sampleCounts = new int[64];

    public TreeBuffer(int classCount)
    {
        _classCount = classCount;
        _classWeights = new double[64 * classCount];
    }

    public void Clear() => _count = 0;

    /// <summary>Appends a leaf and links it to its parent; returns its index.</summary>
    public int Add(int parent, bool isLeft)
    {
        if (_count == _features.Length) Grow();
        int node = _count++;
        _features[node] = -1;
        _binThresholds[node] = 0;
        _thresholds[node] = float.NaN;
        _missingCodes[node] = 0;
        _routing[node] = UnmeasuredRouting.BothRight;
        _left[node] = -1;
        _right[node] = -1;
        _decreases[node] = 0;
        if (parent >= 0)
        {
            if (isLeft) _left[parent] = node;
            else _right[parent] = node;
        }
        return node;
    }

    public void SetNode(int node, ReadOnlySpan<double> classWeights, int sampleCount, int nodeClass)
    {
        classWeights.CopyTo(_classWeights.AsSpan(node * _classCount, _classCount));
        _sampleCounts[node] = sampleCount;
        _nodeClasses[node] = nodeClass;
    }

    public void SetSplit(int node, int feature, byte binThreshold, float threshold, byte missingCode,
        UnmeasuredRouting routing, double decrease)
    {
        _features[node] = feature;
        _binThresholds[node] = binThreshold;
        _thresholds[node] = threshold;
        _missingCodes[node] = missingCode;
        _routing[node] = routing;
        _decreases[node] = decrease;
    }

    public DecisionTree ToTree() => new(_classCount, _features[.._count], _binThresholds[.._count], _thresholds[.._count],
        _missingCodes[.._count], _routing[.._count], _left[.._count], _right[.._count],
        _classWeights[..(_count * _classCount)], _nodeClasses[.._count], _decreases[.._count], _sampleCounts[.._count]);

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
        Array.Resize(ref _classWeights, size * _classCount);
        Array.Resize(ref _nodeClasses, size);
        Array.Resize(ref _decreases, size);
        Array.Resize(ref _sampleCounts, size);
    }
}
