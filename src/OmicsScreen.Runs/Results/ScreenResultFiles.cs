namespace OmicsScreen.Runs.Results;

/// <summary>The names of what a screen writes into its results folder, the manifest aside.</summary>
public static class ScreenResultFiles
{
    public const string Report = "report.html";

    /// <summary>The tables of the cohort check, in the order they are written.</summary>
    public static readonly string[] CohortTables = ["cohort_concordance.tsv", "cohort_markers.tsv", "cohort_effects.tsv", "cohort_validation.tsv"];

    /// <summary>Name of the checkpoint folder inside a results folder while a screen runs.</summary>
    public const string CheckpointFolder = "checkpoint";

    /// <summary>The record of the checkpoint, inside <see cref="CheckpointFolder"/>.</summary>
    public const string CheckpointRecord = "run.json";

    /// <summary>The record of one part of a split screen, inside the part's folder.</summary>
    public const string PartRecord = "part.json";
}
