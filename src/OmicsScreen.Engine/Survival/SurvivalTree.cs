using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Survival;

/// <summary>
/// A grown survival tree stored flat, node 0 the root. Each leaf holds the Nelson-Aalen
/// cumulative hazard of its in-bag samples (Ishwaran, Kogalur, Blackstone &amp; Lauer 2008, Ann.
/// Appl. Stat. 2:841-860) as steps at the training set's event times, and its mortality: that
/// hazard summed over all the training set's event times, the risk score Ishwaran et al. rank by.
/// </summary>
public sealed class SurvivalTree
{
    private readonly int[] _features;
    private readonly byte[] _binThresholds;
    private readonly float[] _thresholds;
    private readonly byte[] _missingCodes;
    private readonly UnmeasuredRouting[] _routing;
    private readonly int[] _leftChildren;
    private readonly int[] _rightChildren;
    private readonly double[] _mortality;
    private readonly double[] _splitStatistics;
    private readonly int[] _sampleCounts;
    private readonly int[] _hazardStarts;
    private readonly int[] _hazardCounts;
    private readonly int[] _hazardTimes;
    private readonly double[] _hazards;

    /// <param name="hazardStarts">Per node, where its hazard steps start in hazardTimes/hazards.</param>
    /// <param name="hazardCounts">Per node, how many hazard steps it has (none for internal nodes).</param>
    /// <param name="hazardTimes">Indices into the training event times at which a leaf's hazard steps up.</param>
    /// <param name="hazards">The leaf's cumulative hazard from that time on.</param>
    internal SurvivalTree(int[] features, byte[] binThresholds, float[] thresholds, byte[] missingCodes,
        UnmeasuredRouting[] routing, int[] leftChildren, int[] rightChildren, double[] mortality,
        double[] splitStatistics, int[] sampleCounts, int[] hazardStarts, int[] hazardCounts, int[] hazardTimes, double[] hazards)
    {
        _features = features;
        _binThresholds = binThresholds;
        _thresholds = thresholds;
        _missingCodes = missingCodes;
        _routing = routing;
        _leftChildren = leftChildren;
        _rightChildren = rightChildren;
        _mortality = mortality;
        _splitStatistics = splitStatistics;
        _sampleCounts = sampleCounts;
        _hazardStarts = hazardStarts;
        _hazardCounts = hazardCounts;
        _hazardTimes = hazardTimes;
        _hazards = hazards;
    }

    public int NodeCount => _features.Length;
    public ReadOnlySpan<int> Features => _features;
    public ReadOnlySpan<float> Thresholds => _thresholds;
    public ReadOnlySpan<int> LeftChildren => _leftChildren;
    public ReadOnlySpan<int> RightChildren => _rightChildren;

    /// <summary>Per node, the mortality of its samples' Nelson-Aalen hazard (meaningful at leaves).</summary>
    public ReadOnlySpan<double> Mortality => _mortality;

    /// <summary>Per internal node, the absolute standardised log-rank statistic of its split; zero at leaves.</summary>
    public ReadOnlySpan<double> SplitStatistics => _splitStatistics;

    public ReadOnlySpan<int> NodeSampleCounts => _sampleCounts;

    public bool IsLeaf(int node) => _features[node] < 0;

    public bool GoesLeft(int node, byte code) =>
        BranchRule.GoesLeft(code, _binThresholds[node], _missingCodes[node], _routing[node]);

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

    /// <summary>A leaf's cumulative hazard at training event time index g (steps are right-continuous).</summary>
    public double CumulativeHazard(int leaf, int eventTimeIndex)
    {
        int start = _hazardStarts[leaf];
        var times = _hazardTimes.AsSpan(start, _hazardCounts[leaf]);
        // Last step at or before g.
        int at = times.BinarySearch(eventTimeIndex);
        int last = at >= 0 ? at : ~at - 1;
        return last >= 0 ? _hazards[start + last] : 0.0;
    }

    /// <summary>Adds each feature's summed split statistics in this tree to totals.</summary>
    public void AddSplitStatistics(Span<double> totals)
    {
        for (int node = 0; node < _features.Length; node++)
            if (_features[node] >= 0) totals[_features[node]] += _splitStatistics[node];
    }
}
