namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>One row of the calibration table: every panel of one shape or design, summarised.</summary>
/// <param name="NonEmptyShare">Share of panels with a non-empty shortlist (the null goal's figure).</param>
/// <param name="MeanDecoyEstimate">Over panels whose estimate is a number (NaN without decoys).</param>
/// <param name="RecallRatio">Our true discoveries summed over panels / the baseline's (a ratio of means, so a panel where the baseline finds nothing still counts); NaN when the baseline found none.</param>
/// <param name="EstimatePairs">Panels with both a selection-aware and a fresh estimate.</param>
/// <param name="MeanSelectionAware">Over locked panels with a finite estimate (the null goal's figure).</param>
public sealed record DesignSummary(
    string Design,
    bool IsNull,
    int ClassCount,
    int Panels,
    double NonEmptyShare,
    double MeanShortlisted,
    double MeanFalseDiscoveryProportion,
    double MeanDecoyEstimate,
    double MeanTrueDiscoveries,
    double MeanBaselineTrueDiscoveries,
    double RecallRatio,
    int PairFound,
    int BaselinePairFound,
    int PairPanels,
    int ThresholdFound,
    int BaselineThresholdFound,
    int ThresholdPanels,
    int NoLockedPanel,
    int EstimatePairs,
    double MeanSelectionAware,
    double MeanFresh,
    double MeanEstimateError,
    double MaxEstimateError)
{
    public static DesignSummary From(string design, IReadOnlyList<PanelCalibration> panels)
    {
        ArgumentNullException.ThrowIfNull(panels);
        if (panels.Count == 0) throw new ArgumentException("A summary needs at least one panel.");
        var paired = panels.Where(p => p.HasEstimatePair).ToList();
        var locked = panels.Where(p => p.LockedPanelSize > 0 && double.IsFinite(p.SelectionAwareEstimate)).ToList();
        var decoys = panels.Where(p => double.IsFinite(p.DecoyEstimate)).ToList();
        double ourTrue = panels.Sum(p => p.TrueDiscoveries), baselineTrue = panels.Sum(p => p.BaselineTrueDiscoveries);
        return new DesignSummary(
            design,
            panels[0].IsNull,
            panels[0].ClassCount,
            panels.Count,
            panels.Count(p => p.Shortlisted > 0) / (double)panels.Count,
            panels.Average(p => p.Shortlisted),
            panels.Average(p => p.FalseDiscoveryProportion),
            decoys.Count == 0 ? double.NaN : decoys.Average(p => p.DecoyEstimate),
            panels.Average(p => p.TrueDiscoveries),
            panels.Average(p => p.BaselineTrueDiscoveries),
            baselineTrue == 0 ? double.NaN : ourTrue / baselineTrue,
            panels.Count(p => p.PairFound == true),
            panels.Count(p => p.BaselinePairFound == true),
            panels.Count(p => p.PairFound is not null),
            panels.Count(p => p.ThresholdFound == true),
            panels.Count(p => p.BaselineThresholdFound == true),
            panels.Count(p => p.ThresholdFound is not null),
            panels.Count(p => p.LockedPanelSize == 0),
            paired.Count,
            locked.Count == 0 ? double.NaN : locked.Average(p => p.SelectionAwareEstimate),
            paired.Count == 0 ? double.NaN : paired.Average(p => p.FreshEstimate),
            paired.Count == 0 ? double.NaN : paired.Average(p => p.EstimateError),
            paired.Count == 0 ? double.NaN : paired.Max(p => p.EstimateError));
    }
}
