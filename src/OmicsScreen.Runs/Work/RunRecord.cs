using System.Text.Json.Serialization;
using OmicsScreen.Data;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Work;

/// <summary>
/// The description of a checkpoint or a part (run.json / part.json, documented in PARTS.md):
/// which run it belongs to, how to load its inputs again, and which units it holds.
/// </summary>
public sealed record RunRecord
{
    public const string ToolName = "omicsscreen";
    public const int CurrentFormatVersion = 1;

    [JsonPropertyName("tool")] public string Tool { get; init; } = ToolName;
    [JsonPropertyName("kind")] public required string Kind { get; init; }
    [JsonPropertyName("format_version")] public int FormatVersion { get; init; } = CurrentFormatVersion;
    [JsonPropertyName("software_version")] public required string SoftwareVersion { get; init; }

    /// <summary>SHA-256 of the panel's content, the settings and the software version, lower-case hex; every unit file carries it.</summary>
    [JsonPropertyName("run_identity")] public required string RunIdentity { get; init; }
    [JsonPropertyName("panel_sha256")] public required string PanelSha256 { get; init; }
    [JsonPropertyName("inputs")] public required IReadOnlyList<RecordedInput> Inputs { get; init; }
    [JsonPropertyName("load_options")] public required PanelLoadOptions LoadOptions { get; init; }
    [JsonPropertyName("screen_options")] public required ScreenOptions ScreenOptions { get; init; }
    [JsonPropertyName("show_sample_ids")] public bool ShowSampleIds { get; init; }
    [JsonPropertyName("command_line")] public IReadOnlyList<string> CommandLine { get; init; } = [];

    /// <summary>1-based part index; 0 for a checkpoint of a whole run.</summary>
    [JsonPropertyName("part")] public int Part { get; init; }
    [JsonPropertyName("parts")] public int Parts { get; init; }

    /// <summary>True once every unit of the part is written; a merge takes complete parts only.</summary>
    [JsonPropertyName("complete")] public bool Complete { get; init; }
    [JsonPropertyName("units")] public IReadOnlyList<string> Units { get; init; } = [];
}

public sealed record RecordedInput(
    [property: JsonPropertyName("path")] string Path,
    [property: JsonPropertyName("bytes")] long Bytes,
    [property: JsonPropertyName("sha256")] string Sha256);
