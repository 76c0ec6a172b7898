using System.Text.Json.Serialization;

namespace OmicsScreen.Runs.Output;

/// <summary>Who holds a results folder's lock, as recorded beside the lock file.</summary>
public sealed record LockHolder(
    [property: JsonPropertyName("process_id")] int ProcessId,
    [property: JsonPropertyName("started_utc")] string StartedUtc,
    [property: JsonPropertyName("machine")] string Machine);
