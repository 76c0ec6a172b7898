namespace OmicsScreen.Screening.Screen;

/// <summary>The panel-size curve and the size it recommends.</summary>
/// <param name="Metric">"auc" for a binary outcome, "accuracy" for more classes.</param>
/// <param name="RecommendedSize">Smallest size whose selection-aware score is within one standard error of the best (Breiman et al. 1984).</param>
public sealed record PanelSizeCurve(string Metric, IReadOnlyList<PanelSizePoint> Points, int RecommendedSize, int FoldCount, int FoldRepeats);
