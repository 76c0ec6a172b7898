namespace OmicsScreen.Engine.Forests;

/// <summary>The plain summary of one grown forest that reports and the command line read.</summary>
/// <param name="OutOfBagError">Fraction of samples with out-of-bag votes whose majority vote is wrong.</param>
/// <param name="PerClassError">Per class (in class-code order), the out-of-bag error among its samples.</param>
/// <param name="OutOfBagAuc">Mann-Whitney AUC of the positive class's out-of-bag vote fraction; null unless binary.</param>
/// <param name="ErrorCurve">Out-of-bag error after 1, 2, ..., TreeCount trees.</param>
/// <param name="MeanDecreaseImpurity">Per feature, the total weighted Gini decrease averaged over trees.</param>
/// <param name="NormalisedDecreaseImpurity">Per feature, the per-tree-normalised mean decrease (sums to 1).</param>
/// <param name="BinningTime">Time spent binning the panel.</param>
/// <param name="TrainingTime">Time spent growing the trees and collecting out-of-bag votes.</param>
/// <param name="Options">The options the forest was grown with, seed included.</param>
/// <param name="FeaturesPerSplit">The resolved number of features tried per node.</param>
public sealed record ForestResult(
    double OutOfBagError,
    IReadOnlyList<double> PerClassError,
    double? OutOfBagAuc,
    IReadOnlyList<double> ErrorCurve,
    IReadOnlyList<double> MeanDecreaseImpurity,
    IReadOnlyList<double> NormalisedDecreaseImpurity,
    TimeSpan BinningTime,
    TimeSpan TrainingTime,
    ForestOptions Options,
    int FeaturesPerSplit);
