using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// What the panel adds over clinical covariates, measured in the panel-size curve's outer folds:
/// a forest on the covariates alone, the fold's locked panel alone, and a forest on both, each
/// scored on the fold's test samples; each sample's held-out predictions averaged over fold
/// repeats and pooled into one score per model.
/// </summary>
/// <param name="Metric">The curve's score: "auc" (two classes), "r_squared" (measured outcome) or "concordance" (Harrell's C, follow-up).</param>
/// <param name="Covariates">The covariate columns, in the order named.</param>
/// <param name="CovariatesAlone">Pooled out-of-fold score of the covariates' forest.</param>
/// <param name="PanelAlone">Pooled out-of-fold score of the folds' locked panels (chance where a fold locked none).</param>
/// <param name="CovariatesAndPanel">Pooled out-of-fold score of the forest on covariates and the fold's panel.</param>
/// <param name="Gain">CovariatesAndPanel minus CovariatesAlone.</param>
/// <param name="GainInterval">Paired interval of the gain (95%).</param>
/// <param name="GainPValue">Two-sided p-value of no gain.</param>
/// <param name="IntervalMethod">"delong" (DeLong et al. 1988, paired) or "bootstrap" (percentile, paired by sample).</param>
/// <param name="SampleCount">Samples pooled (each once, its predictions averaged over fold repeats).</param>
/// <param name="FoldsWithoutPanel">Outer folds whose procedure locked no panel; there covariates and panel is covariates alone.</param>
public sealed record AddedValue(
    string Metric, IReadOnlyList<string> Covariates, double CovariatesAlone, double PanelAlone, double CovariatesAndPanel,
    double Gain, ConfidenceInterval GainInterval, double GainPValue, string IntervalMethod, int SampleCount,
    int FoldCount, int FoldRepeats, int FoldsWithoutPanel, double MeanPanelSize);
