namespace OmicsScreen.Screening.Screen;

/// <summary>
/// One panel size on the curve: the honest estimate (features chosen inside each outer training
/// part) and the optimistic one (features chosen once on all samples) of the same folds.
/// </summary>
/// <param name="HonestAuc">Mean over outer folds of the held-out AUC (binary) or accuracy (more classes).</param>
/// <param name="HonestAucStandardError">SD over folds / sqrt(folds).</param>
/// <param name="HonestError">Mean held-out misclassification rate.</param>
public sealed record PanelSizePoint(
    int PanelSize,
    double HonestAuc,
    double HonestAucSd,
    double HonestAucStandardError,
    double HonestError,
    double OptimisticAuc,
    double OptimisticAucSd,
    double OptimisticError,
    int FoldCount);
