using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Demo;

/// <summary>
/// The invented demo study in memory: the measurement matrix (linear abundances, with missing
/// and below-detection cells), the sample sheet columns, and the truth about every feature.
/// </summary>
public sealed class DemoStudy
{
    internal DemoStudy(FeatureMatrix matrix, string[] status, string[] centre, string[] ageYears,
        string[] sex, IReadOnlyList<DemoFeatureTruth> truth, DemoStudyOptions options, DemoOutcomes outcomes)
    {
        Outcomes = outcomes;
        Matrix = matrix;
        Status = status;
        Centre = centre;
        AgeYears = ageYears;
        Sex = sex;
        Truth = truth;
        Options = options;
    }

    public const string CaseLabel = "case";
    public const string ControlLabel = "control";
    public const string OutcomeColumn = "status";
    public const string CentreColumn = "centre";

    /// <summary>The measured outcome's column: an invented disease-activity score.</summary>
    public const string ActivityColumn = "activity_score";

    /// <summary>The follow-up columns: months followed, and whether a flare ended them.</summary>
    public const string FollowUpColumn = "months_followed";
    public const string EventColumn = "flare";

    /// <summary>The activity score and the follow-up of every sample, as written in the sample sheet.</summary>
    public DemoOutcomes Outcomes { get; }

    public FeatureMatrix Matrix { get; }
    public IReadOnlyList<string> Status { get; }
    public IReadOnlyList<string> Centre { get; }
    public IReadOnlyList<string> AgeYears { get; }
    public IReadOnlyList<string> Sex { get; }
    public IReadOnlyList<DemoFeatureTruth> Truth { get; }
    public DemoStudyOptions Options { get; }

    /// <summary>The centre whose samples were processed in the shifted batch.</summary>
    public string BatchAffectedCentre => Options.Centres[^1].Centre;
}
