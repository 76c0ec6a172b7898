using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Survival;

/// <summary>
/// A grown survival tree: its <see cref="SplitTopology"/>, each split's log-rank statistic, and at
/// each leaf the Nelson-Aalen cumulative hazard of its in-bag samples (Ishwaran, Kogalur, Blackstone
/// &amp; Lauer 2008, Ann. Appl. Stat. 2:841-860) as steps at the training set's event times, with its
/// mortality: that hazard summed over all the training event times, the risk score they rank by.
/// </summary>
public sealed class SurvivalTree
{
    private readonly double[] _mortality;
    private readonly double[] _splitStatistics;
    private readonly int[] _hazardStarts;
    private readonly int[] _hazardCounts;
    private readonly int[] _hazardTimes;
    private readonly double[] _hazards;

    /// <param name="hazardStarts">Per node, where its hazard steps start in hazardTimes/hazards.</param>
    /// <param name="hazardCounts">Per node, how many hazard steps it has (none for internal nodes).</param>
    /// <param name="hazardTimes">Indices into the training event times at which a leaf's hazard steps up.</param>
    /// <param name="hazards">The leaf's cumulative hazard from that time on.</param>
    internal SurvivalTree(SplitTopology topology, double[] mortality, double[] splitStatistics, int[] hazardStarts,
        int[] hazardCounts, int[] hazardTimes, double[] hazards)
    {
        Topology = topology;
        _mortality = mortality;
        _splitStatistics = splitStatistics;
        _hazardStarts = hazardStarts;
        _hazardCounts = hazardCounts;
        _hazardTimes = hazardTimes;
        _hazards = hazards;
    }

    public SplitTopology Topology { get; }
    /// <summary>Per node, the mortality of its samples' Nelson-Aalen hazard (meaningful at leaves).</summary>
    public ReadOnlySpan<double> Mortality => _mortality;

    /// <summary>Per internal node, the absolute standardised log-rank statistic of its split; zero at leaves.</summary>
    public ReadOnlySpan<double> SplitStatistics => _splitStatistics;

    /// <summary>The mortality of the leaf a sample of a binned matrix reaches.</summary>
    public double MortalityOf(BinnedMatrix matrix, int sample) => _mortality[Topology.LeafOf(matrix, sample)];

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
    public void AddSplitStatistics(Span<double> totals) => Topology.AddPerSplitFeature(_splitStatistics, totals);
}
