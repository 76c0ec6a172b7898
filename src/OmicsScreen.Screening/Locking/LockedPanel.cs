using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Locking;

/// <summary>
/// A marker panel frozen for validation: the markers, the forest grown on them alone, the
/// decision threshold and what the discovery data looked like. Nothing in it may change once a
/// validation cohort has been scored with it.
/// </summary>
/// <param name="MarkerNames">The markers, in the order the trees index them.</param>
/// <param name="Trees">The forest; tree feature indices refer to <paramref name="MarkerNames"/>.</param>
/// <param name="ClassNames">The outcome classes, in class-code order.</param>
/// <param name="PositiveClass">Class code whose probability the threshold and the AUC read.</param>
/// <param name="Markers">Discovery summary of each marker, in marker order, for scale checks.</param>
/// <param name="Threshold">Positive-class probability at or above which a sample is called positive; null for more than two classes (majority vote).</param>
/// <param name="OutOfBagAuc">Discovery out-of-bag AUC of the positive-class probability; null unless binary.</param>
/// <param name="Provenance">Where the panel came from.</param>
public sealed record LockedPanel(
    IReadOnlyList<string> MarkerNames,
    IReadOnlyList<DecisionTree> Trees,
    IReadOnlyList<string> ClassNames,
    int PositiveClass,
    IReadOnlyList<MarkerScale> Markers,
    double? Threshold,
    double? OutOfBagAuc,
    LockProvenance Provenance)
{
    public int MarkerCount => MarkerNames.Count;
    public int ClassCount => ClassNames.Count;
    public bool IsBinary => ClassNames.Count == 2;

    /// <summary>Throws when the parts do not fit together (a tree splits on a marker that is not there, etc.).</summary>
    public void Validate()
    {
        if (MarkerNames.Count < 1) throw new ArgumentException("A locked panel needs at least one marker.");
        if (Markers.Count != MarkerNames.Count) throw new ArgumentException("One discovery summary is needed per marker.");
        if (ClassNames.Count < 2) throw new ArgumentException("A locked panel needs at least two classes.");
        if ((uint)PositiveClass >= (uint)ClassNames.Count) throw new ArgumentException("The positive class is out of range.");
        if (Trees.Count < 1) throw new ArgumentException("A locked panel needs at least one tree.");
        if (IsBinary != Threshold.HasValue) throw new ArgumentException("A threshold is kept for two classes only, and always for two.");
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var name in MarkerNames)
            if (!seen.Add(name)) throw new ArgumentException($"Marker '{name}' is listed twice.");
        for (int t = 0; t < Trees.Count; t++)
        {
            var tree = Trees[t];
            if (tree.ClassCount != ClassNames.Count) throw new ArgumentException($"Tree {t} has {tree.ClassCount} classes, not {ClassNames.Count}.");
            var features = tree.Features;
            var classes = tree.NodeClasses;
            for (int node = 0; node < tree.NodeCount; node++)
            {
                if (features[node] >= MarkerNames.Count || features[node] < -1)
                    throw new ArgumentException($"Tree {t}, node {node} splits on marker {features[node]}, which does not exist.");
                if ((uint)classes[node] >= (uint)ClassNames.Count)
                    throw new ArgumentException($"Tree {t}, node {node} predicts class {classes[node]}, which does not exist.");
                if (features[node] >= 0 && float.IsNaN(tree.Thresholds[node]))
                    throw new ArgumentException($"Tree {t}, node {node} splits without a threshold.");
            }
        }
    }
}
