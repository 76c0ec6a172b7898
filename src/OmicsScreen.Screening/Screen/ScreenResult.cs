using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>Everything a screen found, as plain records for tables and reports.</summary>
/// <param name="Features">Every feature's forest evidence, in panel order.</param>
/// <param name="Order">Feature indices in the screen's final order.</param>
/// <param name="Shortlist">The markers that pass the frequency and q-value thresholds, in order.</param>
/// <param name="ShortlistCorrelations">Spearman correlations between shortlisted markers, in shortlist order.</param>
/// <param name="Univariate">The class rank tests; empty for other outcome kinds (<see cref="MeasuredMarkers"/>, <see cref="FollowUpMarkers"/>).</param>
/// <param name="UnivariateRanks">Per feature, rank by the univariate p-value (1 = smallest).</param>
/// <param name="PanelSize">Null when the curve was skipped.</param>
/// <param name="StageSeconds">Wall time of each stage that ran.</param>
/// <param name="Cohorts">The cohort check; null without a cohort column with at least two cohorts.</param>
public sealed record ScreenResult(
    ScreenSettings Settings,
    RepeatImportances Repeats,
    IReadOnlyList<FeatureSummary> Features,
    IReadOnlyList<int> Order,
    IReadOnlyList<ShortlistEntry> Shortlist,
    double[,] ShortlistCorrelations,
    StabilitySummary Stability,
    DecoyEstimate Decoys,
    ReferenceForestSummary ReferenceForest,
    UnivariateTable Univariate,
    IReadOnlyList<int> UnivariateRanks,
    PanelSizeCurve? PanelSize,
    IReadOnlyDictionary<ScreenStage, double> StageSeconds,
    CohortResult? Cohorts)
{
    /// <summary>How many markers, from the top of the shortlist, the screen locks into a panel; 0 when none.</summary>
    public int LockedPanelSize { get; init; }

    /// <summary>
    /// The selection-aware estimate (AUC for two classes, accuracy otherwise) of the panel that is
    /// locked; NaN when no panel is locked or the curve was skipped.
    /// </summary>
    public double LockedPanelEstimate { get; init; } = double.NaN;

    /// <summary>Every feature's statistics against a measured outcome, in panel order; empty for other kinds.</summary>
    public IReadOnlyList<MeasuredOutcomeMarker> MeasuredMarkers { get; init; } = [];

    /// <summary>Every feature's statistics against follow-up, in panel order; empty for other kinds.</summary>
    public IReadOnlyList<FollowUpMarker> FollowUpMarkers { get; init; } = [];

    /// <summary>How each shortlisted marker acts: effect shapes and interaction partners (empty for an empty shortlist).</summary>
    public Effects.ScreenEffects Effects { get; init; } = OmicsScreen.Screening.Effects.ScreenEffects.Empty;

    /// <summary>The outcome kind screened.</summary>
    public OmicsScreen.Engine.Panels.OutcomeKind Kind { get; init; } = OmicsScreen.Engine.Panels.OutcomeKind.Classes;

    /// <summary>
    /// What the panel adds over the clinical covariates (--covariates), measured in the curve's
    /// outer folds; null without covariates, without the curve, or with more than two classes.
    /// </summary>
    public OmicsScreen.Screening.Covariates.AddedValue? AddedValue { get; init; }

    /// <summary>Which shortlisted markers only track a covariate; null without covariates or shortlist, and for outcome kinds other than classes.</summary>
    public OmicsScreen.Screening.Covariates.CovariateTracking? CovariateTracking { get; init; }
}
