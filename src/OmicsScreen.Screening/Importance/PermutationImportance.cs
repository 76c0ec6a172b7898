namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Out-of-bag permutation importance of every feature of a forest (Breiman 2001), one entry per
/// feature in the forest's column order.
/// </summary>
/// <param name="MeanAccuracyDrop">Mean over all trees of (OOB accuracy - OOB accuracy with the feature permuted).</param>
/// <param name="StandardError">SD over trees (n - 1 denominator) of the per-tree drop, divided by sqrt(trees).</param>
/// <param name="MeanBrierIncrease">Mean over all trees of (OOB Brier score with the feature permuted - OOB Brier score).</param>
public sealed record PermutationImportance(double[] MeanAccuracyDrop, double[] StandardError, double[] MeanBrierIncrease);
