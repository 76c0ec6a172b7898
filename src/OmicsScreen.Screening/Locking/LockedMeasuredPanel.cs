using OmicsScreen.Engine.Regression;

namespace OmicsScreen.Screening.Locking;

/// <summary>
/// A marker panel for a measured outcome, frozen for validation: the markers, the regression
/// forest grown on them alone over all discovery samples, its out-of-bag accuracy and what the
/// discovery data looked like. The prediction of a sample is the mean of its trees' leaf means
/// (Breiman 2001, section 11).
/// </summary>
/// <param name="MarkerNames">The markers, in the order the trees index them.</param>
/// <param name="Trees">The forest; tree feature indices refer to <paramref name="MarkerNames"/>.</param>
/// <param name="OutcomeName">The discovery outcome column the forest predicts.</param>
/// <param name="Markers">Discovery summary of each marker, in marker order, for scale checks.</param>
/// <param name="OutOfBagRSquared">Discovery out-of-bag R² (1 - MSE / variance, divisor n).</param>
/// <param name="OutOfBagRootMeanSquaredError">Discovery out-of-bag root mean squared error, in the outcome's units.</param>
/// <param name="Provenance">Where the panel came from.</param>
public sealed record LockedMeasuredPanel(
    IReadOnlyList<string> MarkerNames,
    IReadOnlyList<RegressionTree> Trees,
    string OutcomeName,
    IReadOnlyList<MarkerScale> Markers,
    double OutOfBagRSquared,
    double OutOfBagRootMeanSquaredError,
    LockProvenance Provenance)
{
    public int MarkerCount => MarkerNames.Count;

    /// <summary>Throws when the parts do not fit together (a tree splits on a marker that is not there, etc.).</summary>
    public void Validate()
    {
        LockedPanelChecks.Markers(MarkerNames, Markers);
        if (Trees.Count < 1) throw new ArgumentException("A locked panel needs at least one tree.");
        for (int t = 0; t < Trees.Count; t++)
        {
            LockedPanelChecks.Topology(Trees[t].Topology, MarkerNames.Count, t);
            foreach (double mean in Trees[t].NodeMeans)
                if (!double.IsFinite(mean)) throw new ArgumentException($"Tree {t} has a node mean that is not a finite number.");
        }
    }
}
