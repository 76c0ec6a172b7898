using System.Text.Json.Serialization;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>The screened panel as the manifest describes it: its size, outcome, layout and what was left out.</summary>
public sealed record ManifestPanel
{
    public required int Samples { get; init; }
    public required int Features { get; init; }
    /// <summary>classes, measured or time_to_event.</summary>
    public required string OutcomeKind { get; init; }

    /// <summary>The class or measured outcome's column; the follow-up time's column for time to event.</summary>
    public required string OutcomeColumn { get; init; }

    /// <summary>The event column of a time-to-event outcome; absent for other kinds.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public string? EventColumn { get; init; }

    /// <summary>Events and censored samples of a time-to-event outcome; absent for other kinds.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public int? Events { get; init; }

    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public int? Censored { get; init; }

    /// <summary>The classes with their sample counts; absent for other kinds.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public IReadOnlyList<ManifestClass>? Classes { get; init; }

    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public string? PositiveClass { get; init; }
    public string? CohortColumn { get; init; }
    public string? SubjectColumn { get; init; }

    /// <summary>The covariate columns of --covariates, in order; absent without them.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public IReadOnlyList<string>? Covariates { get; init; }
    public required bool FeaturesInRows { get; init; }
    public required bool LongTable { get; init; }

    /// <summary>"I/N" when only one block of the feature columns was read.</summary>
    public string? FeatureBlock { get; init; }

    /// <summary>How many features a --keep-features list named, when one was given.</summary>
    public int? FeaturesKeptFromList { get; init; }

    public required int DroppedSamples { get; init; }
}
