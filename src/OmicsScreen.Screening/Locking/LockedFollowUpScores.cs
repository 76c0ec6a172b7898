namespace OmicsScreen.Screening.Locking;

/// <summary>A locked follow-up panel's risk score and risk group for every sample of a new cohort.</summary>
/// <param name="SampleIds">Sample ids, in the new matrix's order.</param>
/// <param name="RiskScores">Per sample, the ensemble mortality (higher: more events expected, earlier).</param>
/// <param name="HighRisk">Per sample, whether the risk score is above the discovery median (<paramref name="RiskGroupCut"/>).</param>
/// <param name="RiskGroupCut">The discovery out-of-bag median risk score.</param>
/// <param name="Warnings">Markers that look measured on another scale than in discovery, or not at all.</param>
public sealed record LockedFollowUpScores(
    IReadOnlyList<string> SampleIds,
    double[] RiskScores,
    bool[] HighRisk,
    double RiskGroupCut,
    IReadOnlyList<ScaleWarning> Warnings)
{
    public int SampleCount => SampleIds.Count;

    public int HighRiskCount
    {
        get
        {
            int count = 0;
            foreach (bool high in HighRisk) if (high) count++;
            return count;
        }
    }
}
