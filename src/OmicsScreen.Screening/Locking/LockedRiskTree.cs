using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Locking;

/// <summary>
/// One survival tree of a locked follow-up panel, reduced to what scoring needs: its split
/// topology and, per node, the mortality of its in-bag samples' Nelson-Aalen cumulative hazard
/// summed over the discovery event times (Ishwaran, Kogalur, Blackstone &amp; Lauer 2008). The
/// mortality is computed once from the discovery event-time grid, so scoring needs no grid.
/// </summary>
public sealed class LockedRiskTree
{
    private readonly double[] _nodeMortality;

    public LockedRiskTree(SplitTopology topology, double[] nodeMortality)
    {
        ArgumentNullException.ThrowIfNull(topology);
        ArgumentNullException.ThrowIfNull(nodeMortality);
        if (nodeMortality.Length != topology.NodeCount) throw new ArgumentException("Every node needs a mortality.");
        Topology = topology;
        _nodeMortality = nodeMortality;
    }

    public SplitTopology Topology { get; }

    /// <summary>Per node, the mortality of its in-bag samples (the score at leaves).</summary>
    public ReadOnlySpan<double> NodeMortality => _nodeMortality;

    /// <summary>The mortality of the leaf a sample of a raw matrix (the panel's markers, in order) reaches.</summary>
    public double MortalityOf(FeatureMatrix matrix, int sample) => _nodeMortality[Topology.LeafOf(matrix, sample)];
}
