using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>What the calibration suite measured on one panel.</summary>
/// <param name="Design">The shape or design (see <see cref="TestSupport.Calibration.CalibrationCatalogue"/>).</param>
/// <param name="FalseDiscoveryProportion">False / max(1, shortlisted).</param>
/// <param name="DecoyEstimate">The screen's target-decoy estimate of its false discovery rate; NaN without decoys.</param>
/// <param name="PairFound">Both of the interacting pair shortlisted; null when the design has no pair.</param>
/// <param name="BaselinePairFound">Both of the pair found by the univariate baseline; null without a pair.</param>
/// <param name="ThresholdFound">The threshold marker shortlisted; null when the design has none.</param>
/// <param name="BaselineThresholdFound">The threshold marker found by the baseline; null without one.</param>
/// <param name="LockedPanelSize">0 when no panel was locked.</param>
/// <param name="SelectionAwareEstimate">The screen's selection-aware estimate of the locked panel (AUC, or accuracy for more than two classes); NaN when none.</param>
/// <param name="FreshEstimate">The locked panel's AUC (accuracy for more classes) on a fresh cohort of the same model; NaN when no panel was locked.</param>
/// <param name="NullFeaturePValues">The screen's p-value of every feature not related to the outcome.</param>
/// <param name="EstimateStandardError">The DeLong (1988) standard error of the AUC of the locked procedure's pooled held-out probabilities: the sampling error of the selection-aware estimate at this sample size; NaN without a two-class locked panel.</param>
/// <param name="SpecialMarkers">Where the interacting pair and the threshold marker ended up (screen order, forest, rank-test and final p, q), for reading a miss; empty when the design has neither.</param>
public sealed record PanelCalibration(
    string Design,
    ulong Seed,
    bool IsNull,
    int ClassCount,
    int RelatedCount,
    int Shortlisted,
    int TrueDiscoveries,
    int FalseDiscoveries,
    double FalseDiscoveryProportion,
    double DecoyEstimate,
    int BaselineDiscoveries,
    int BaselineTrueDiscoveries,
    bool? PairFound,
    bool? BaselinePairFound,
    bool? ThresholdFound,
    bool? BaselineThresholdFound,
    int LockedPanelSize,
    double SelectionAwareEstimate,
    double FreshEstimate,
    double[] NullFeaturePValues,
    double EstimateStandardError,
    string SpecialMarkers,
    double Seconds)
{
    /// <summary>The model's outcome kind; the estimates are AUC or accuracy (classes), R^2 (measured) or Harrell's C (follow-up).</summary>
    public OutcomeKind Kind { get; init; } = OutcomeKind.Classes;

    /// <summary>Share of discovery samples whose event was observed (follow-up only; NaN otherwise).</summary>
    public double EventShare { get; init; } = double.NaN;

    /// <summary>Outer folds of the panel-size curve whose inner screen locked nothing (scored as chance); -1 without a curve.</summary>
    public int FoldsWithoutPanel { get; init; } = -1;

    /// <summary>Outer folds of the panel-size curve (folds x repeats); 0 without a curve.</summary>
    public int CurveFolds { get; init; }

    /// <summary>Mean size of the panel the folds locked (0 for a fold without one); NaN without a curve.</summary>
    public double MeanFoldPanelSize { get; init; } = double.NaN;

    /// <summary>Each false shortlisted marker's evidence (frequency, forest, rank-test, final p, q, largest |Pearson r| with a related feature), for reading a failure; empty when none.</summary>
    public string FalseEntries { get; init; } = "";

    /// <summary>Unrelated features at p &lt;= 0.001 / &lt;= 0.0001 by the forest's p, the rank test's and the final p.</summary>
    public string SmallNullPValues { get; init; } = "";

    /// <summary>Each related marker the baseline found and the screen missed, with its evidence; empty when none.</summary>
    public string MissedEntries { get; init; } = "";

    /// <summary>The planted pair named as forest partners (either member names the other); null when the design has no pair.</summary>
    public bool? PairNamedAsPartners { get; init; }

    /// <summary>Partner links named between shortlisted markers (each marker's list, counted from each side).</summary>
    public int PartnerLinks { get; init; }

    /// <summary>Partner links that are not the planted pair (a marker naming any feature other than its planted partner).</summary>
    public int FalsePartnerLinks { get; init; }

    /// <summary>|selection-aware estimate - fresh estimate|; NaN when either is missing.</summary>
    public double EstimateError => Math.Abs(SelectionAwareEstimate - FreshEstimate);

    /// <summary>selection-aware estimate - fresh estimate; NaN when either is missing.</summary>
    public double EstimateDifference => SelectionAwareEstimate - FreshEstimate;

    /// <summary>Both estimates exist, so the selection-aware one can be judged.</summary>
    public bool HasEstimatePair => double.IsFinite(SelectionAwareEstimate) && double.IsFinite(FreshEstimate);
}
