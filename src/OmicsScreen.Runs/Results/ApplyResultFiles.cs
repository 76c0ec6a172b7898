namespace OmicsScreen.Runs.Results;

/// <summary>The names of what `apply` writes into its results folder, the manifest aside.</summary>
public static class ApplyResultFiles
{
    public const string Scores = "scores.tsv";
    public const string Evaluation = "evaluation.json";
    public const string Calibration = "calibration.tsv";
    public const string Confusion = "confusion.tsv";
    public const string Report = "apply_report.html";

    /// <summary>The Kaplan-Meier curves of the risk groups, for a panel locked on a time to an event.</summary>
    public const string RiskGroups = "risk_groups.tsv";
}
