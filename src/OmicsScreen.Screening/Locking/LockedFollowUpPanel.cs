namespace OmicsScreen.Screening.Locking;

/// <summary>
/// A marker panel for censored follow-up, frozen for validation: the markers, the random
/// survival forest grown on them alone over all discovery samples, and its risk score, the
/// ensemble mortality (the mean over trees of the leaf's mortality; Ishwaran et al. 2008). The
/// risk score ranks samples (higher: more events expected, earlier); it is not a calibrated
/// survival probability.
/// </summary>
/// <param name="MarkerNames">The markers, in the order the trees index them.</param>
/// <param name="Trees">The forest; tree feature indices refer to <paramref name="MarkerNames"/>.</param>
/// <param name="TimeColumn">The discovery follow-up time column.</param>
/// <param name="EventColumn">The discovery event column.</param>
/// <param name="Markers">Discovery summary of each marker, in marker order, for scale checks.</param>
/// <param name="OutOfBagConcordance">Harrell's C of the discovery out-of-bag risk scores.</param>
/// <param name="RiskGroupCut">The median of the discovery out-of-bag risk scores: a sample scoring above it is in the high-risk group.</param>
/// <param name="DiscoveryEventCount">Events among the discovery samples.</param>
/// <param name="Provenance">Where the panel came from.</param>
public sealed record LockedFollowUpPanel(
    IReadOnlyList<string> MarkerNames,
    IReadOnlyList<LockedRiskTree> Trees,
    string TimeColumn,
    string EventColumn,
    IReadOnlyList<MarkerScale> Markers,
    double OutOfBagConcordance,
    double RiskGroupCut,
    int DiscoveryEventCount,
    LockProvenance Provenance)
{
    public int MarkerCount => MarkerNames.Count;

    /// <summary>Whether a risk score puts a sample in the high-risk group: strictly above the discovery median.</summary>
    public bool IsHighRisk(double riskScore) => riskScore > RiskGroupCut;

    /// <summary>Throws when the parts do not fit together (a tree splits on a marker that is not there, etc.).</summary>
    public void Validate()
    {
        LockedPanelChecks.Markers(MarkerNames, Markers);
        if (Trees.Count < 1) throw new ArgumentException("A locked panel needs at least one tree.");
        if (!double.IsFinite(RiskGroupCut)) throw new ArgumentException("The risk-group cut must be a finite number.");
        for (int t = 0; t < Trees.Count; t++)
        {
            LockedPanelChecks.Topology(Trees[t].Topology, MarkerNames.Count, t);
            foreach (double mortality in Trees[t].NodeMortality)
                if (!double.IsFinite(mortality) || mortality < 0) throw new ArgumentException($"Tree {t} has a node mortality that is not a finite, non-negative number.");
        }
    }
}
