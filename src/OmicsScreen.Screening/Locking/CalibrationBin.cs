namespace OmicsScreen.Screening.Locking;

/// <summary>One group of samples with similar predicted probability, and how often they were positive.</summary>
/// <param name="LowestPredicted">Smallest predicted positive-class probability in the group.</param>
/// <param name="HighestPredicted">Largest predicted positive-class probability in the group.</param>
/// <param name="MeanPredicted">Mean predicted positive-class probability.</param>
/// <param name="ObservedPositiveRate">Fraction of the group truly in the positive class.</param>
/// <param name="SampleCount">Samples in the group.</param>
public sealed record CalibrationBin(
    double LowestPredicted,
    double HighestPredicted,
    double MeanPredicted,
    double ObservedPositiveRate,
    int SampleCount);
