using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Locking;

/// <summary>The checks every locked panel's parts pass, whatever the outcome kind.</summary>
internal static class LockedPanelChecks
{
    public static void Markers(IReadOnlyList<string> markerNames, IReadOnlyList<MarkerScale> scales)
    {
        if (markerNames.Count < 1) throw new ArgumentException("A locked panel needs at least one marker.");
        if (scales.Count != markerNames.Count) throw new ArgumentException("One discovery summary is needed per marker.");
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var name in markerNames)
            if (!seen.Add(name)) throw new ArgumentException($"Marker '{name}' is listed twice.");
    }

    public static void Topology(SplitTopology topology, int markerCount, int tree)
    {
        var features = topology.Features;
        for (int node = 0; node < topology.NodeCount; node++)
        {
            if (features[node] >= markerCount || features[node] < -1)
                throw new ArgumentException($"Tree {tree}, node {node} splits on marker {features[node]}, which does not exist.");
            if (features[node] >= 0 && float.IsNaN(topology.Thresholds[node]))
                throw new ArgumentException($"Tree {tree}, node {node} splits without a threshold.");
        }
    }
}
