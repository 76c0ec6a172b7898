namespace OmicsScreen.Screening.Screen;

/// <summary>The panel-size curve, the size it recommends, and the selection-aware estimate of the panel that is locked.</summary>
/// <param name="Metric">"auc" for a binary outcome, "accuracy" for more classes.</param>
/// <param name="RecommendedSize">Smallest size whose selection-aware score is within one standard error of the best (Breiman et al. 1984), over the whole grid.</param>
public sealed record PanelSizeCurve(string Metric, IReadOnlyList<PanelSizePoint> Points, int RecommendedSize, int FoldCount, int FoldRepeats)
{
    /// <summary>
    /// Markers locked: the one-standard-error choice among sizes no longer than the shortlist, so
    /// the locked panel is always the shortlist or a prefix of it; 0 when the shortlist is empty.
    /// </summary>
    public int LockedSize { get; init; }

    /// <summary>
    /// The selection-aware estimate of the locking procedure itself: in each outer fold the inner
    /// screen's own shortlist is cut by the same rule, with the size chosen on the other folds'
    /// scores only, and scored on the held-out part (chance where the fold's list is empty).
    /// </summary>
    public double LockedEstimate { get; init; } = double.NaN;

    /// <summary>SD of the folds' locked-panel scores / sqrt(folds).</summary>
    public double LockedEstimateStandardError { get; init; } = double.NaN;

    /// <summary>Outer folds whose inner screen shortlisted nothing, so their procedure locked no panel.</summary>
    public int FoldsWithoutPanel { get; init; }

    /// <summary>Mean number of markers the folds' procedure locked (folds without a panel count 0).</summary>
    public double MeanFoldPanelSize { get; init; }

    /// <summary>
    /// Held-out probability of the positive class under the locked procedure, every outer fold's
    /// test samples pooled (0.5 where a fold locked nothing); with <see cref="LockedOutOfFoldPositive"/>
    /// the cross-validated ROC curve of the locked panel. Empty for more than two classes.
    /// </summary>
    public IReadOnlyList<double> LockedOutOfFoldScores { get; init; } = [];

    /// <summary>Whether each of <see cref="LockedOutOfFoldScores"/> belongs to a sample of the positive class.</summary>
    public IReadOnlyList<bool> LockedOutOfFoldPositive { get; init; } = [];

    /// <summary>Each outer fold's locked panel and its held-out score, in fold order (for the added value over covariates).</summary>
    internal IReadOnlyList<FoldPanel> FoldPanels { get; init; } = [];
}
