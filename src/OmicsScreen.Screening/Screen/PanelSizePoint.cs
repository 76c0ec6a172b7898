namespace OmicsScreen.Screening.Screen;

/// <summary>
/// One panel size on the curve: the selection-aware estimate (features chosen inside each outer training
/// part) and the optimistic one (features chosen once on all samples) of the same folds.
/// </summary>
/// <param name="SelectionAwareAuc">Mean over outer folds of the held-out AUC (binary) or accuracy (more classes).</param>
/// <param name="SelectionAwareAucStandardError">SD over folds / sqrt(folds).</param>
/// <param name="SelectionAwareError">Mean held-out misclassification rate (mean squared error for a measured outcome, 1 - C for follow-up).</param>
public sealed record PanelSizePoint(
    int PanelSize,
    double SelectionAwareAuc,
    double SelectionAwareAucSd,
    double SelectionAwareAucStandardError,
    double SelectionAwareError,
    double OptimisticAuc,
    double OptimisticAucSd,
    double OptimisticError,
    int FoldCount)
{
    /// <summary>
    /// Mean over outer folds of the held-out root mean squared error, in the outcome's units, of a
    /// measured outcome's selection-aware panels; NaN for other kinds.
    /// </summary>
    public double SelectionAwareRootMeanSquaredError { get; init; } = double.NaN;

    /// <summary>The same for the optimistic panels (markers chosen once on all samples).</summary>
    public double OptimisticRootMeanSquaredError { get; init; } = double.NaN;
}
