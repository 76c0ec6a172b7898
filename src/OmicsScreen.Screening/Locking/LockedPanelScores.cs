namespace OmicsScreen.Screening.Locking;

/// <summary>The locked panel's verdict on every sample of a new cohort.</summary>
/// <param name="SampleIds">Sample ids, in the new matrix's order.</param>
/// <param name="ClassNames">Classes, in class-code order.</param>
/// <param name="Probabilities">Fraction of trees voting for each class, sample-major (ClassNames.Count per sample).</param>
/// <param name="PredictedClasses">Per sample, the class called: the positive class at or above the locked threshold (binary), else the majority vote.</param>
/// <param name="Warnings">Markers that look measured on another scale than in discovery.</param>
public sealed record LockedPanelScores(
    IReadOnlyList<string> SampleIds,
    IReadOnlyList<string> ClassNames,
    int PositiveClass,
    double? Threshold,
    double[] Probabilities,
    int[] PredictedClasses,
    IReadOnlyList<ScaleWarning> Warnings)
{
    public int SampleCount => SampleIds.Count;
    public int ClassCount => ClassNames.Count;

    public double Probability(int sample, int classCode) => Probabilities[sample * ClassNames.Count + classCode];
}
