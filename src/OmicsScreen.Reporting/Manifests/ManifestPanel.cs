namespace OmicsScreen.Reporting.Manifests;

/// <summary>The screened panel as the manifest describes it: its size, outcome, layout and what was left out.</summary>
public sealed record ManifestPanel
{
    public required int Samples { get; init; }
    public required int Features { get; init; }
    public required string OutcomeColumn { get; init; }
    public required IReadOnlyList<ManifestClass> Classes { get; init; }
    public required string PositiveClass { get; init; }
    public string? CohortColumn { get; init; }
    public string? SubjectColumn { get; init; }
    public required bool FeaturesInRows { get; init; }
    public required bool LongTable { get; init; }

    /// <summary>"I/N" when only one block of the feature columns was read.</summary>
    public string? FeatureBlock { get; init; }

    /// <summary>How many features a --keep-features list named, when one was given.</summary>
    public int? FeaturesKeptFromList { get; init; }

    public required int DroppedSamples { get; init; }
}
