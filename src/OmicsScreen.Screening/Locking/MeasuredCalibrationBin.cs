namespace OmicsScreen.Screening.Locking;

/// <summary>One group of samples with similar predictions, and the mean of what was observed in them.</summary>
/// <param name="LowestPredicted">Smallest prediction in the group.</param>
/// <param name="HighestPredicted">Largest prediction in the group.</param>
/// <param name="MeanPredicted">Mean prediction of the group.</param>
/// <param name="MeanObserved">Mean observed outcome of the group.</param>
/// <param name="SampleCount">Samples in the group.</param>
public sealed record MeasuredCalibrationBin(
    double LowestPredicted,
    double HighestPredicted,
    double MeanPredicted,
    double MeanObserved,
    int SampleCount);
