using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Univariate;

/// <summary>
/// Univariate statistics of one feature for one contrast (a class against the rest) within one
/// scope (all samples, or one cohort). Plain values for a report or table writer.
/// </summary>
/// <param name="FeatureIndex">Column of the feature in the panel.</param>
/// <param name="ContrastClass">The class compared against the rest: the positive class of a binary outcome, each class in turn otherwise.</param>
/// <param name="ReferenceGroup">What the class is compared with: the other class's name for a binary outcome, "rest" otherwise.</param>
/// <param name="Cohort">The cohort level of this row, or null for the row over all samples.</param>
/// <param name="ClassSampleCount">Samples of the contrast class with a measured or below-detection value.</param>
/// <param name="RestSampleCount">Samples of the reference group with a measured or below-detection value.</param>
/// <param name="ClassMedian">Sample median of the contrast class (mean of the two middle values for an even count, Hyndman-Fan type 7); NaN when unavailable.</param>
/// <param name="ClassMedianBelowDetection">True when the median falls among below-detection cells, so it is only known to lie under the limit.</param>
/// <param name="Log2MedianRatio">log2(ClassMedian / RestMedian); NaN with <paramref name="RatioUnavailable"/> saying why.</param>
/// <param name="Auc">Mann-Whitney AUC of the class against the rest: P(class &gt; rest) + P(tie) / 2.</param>
/// <param name="AucStandardError">DeLong standard error of the AUC.</param>
/// <param name="AucInterval">Normal interval from the DeLong standard error.</param>
/// <param name="U">Mann-Whitney U of the contrast class.</param>
/// <param name="PValue">Two-sided Mann-Whitney p-value (normal approximation, tie and continuity corrected).</param>
/// <param name="QValue">Benjamini-Hochberg adjusted p-value across the features of the same contrast and scope.</param>
/// <param name="MissingPercent">Percentage of the scope's samples whose cell is missing.</param>
/// <param name="BelowDetectionPercent">Percentage of the scope's samples whose cell is below detection.</param>
public sealed record MarkerStatistics(
    int FeatureIndex,
    string Feature,
    string ContrastClass,
    string ReferenceGroup,
    string? Cohort,
    int ClassSampleCount,
    int RestSampleCount,
    double ClassMedian,
    bool ClassMedianBelowDetection,
    double RestMedian,
    bool RestMedianBelowDetection,
    double Log2MedianRatio,
    RatioUnavailableReason RatioUnavailable,
    EffectDirection Direction,
    double Auc,
    double AucStandardError,
    ConfidenceInterval AucInterval,
    double U,
    double PValue,
    double QValue,
    double MissingPercent,
    double BelowDetectionPercent);
