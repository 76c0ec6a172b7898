namespace OmicsScreen.Screening.Locking;

/// <summary>A locked measured panel's prediction for every sample of a new cohort.</summary>
/// <param name="SampleIds">Sample ids, in the new matrix's order.</param>
/// <param name="OutcomeName">The discovery outcome the predictions are in the units of.</param>
/// <param name="Predictions">Per sample, the forest's prediction (mean of the trees' leaf means).</param>
/// <param name="Warnings">Markers that look measured on another scale than in discovery, or not at all.</param>
public sealed record LockedMeasuredScores(
    IReadOnlyList<string> SampleIds,
    string OutcomeName,
    double[] Predictions,
    IReadOnlyList<ScaleWarning> Warnings)
{
    public int SampleCount => SampleIds.Count;
}
