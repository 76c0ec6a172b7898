using System.Text.Json;
using System.Text.Json.Serialization;

namespace OmicsScreen.Reporting.Json;

/// <summary>
/// Writes a string-keyed dictionary with its keys in ordinal order, whatever order the dictionary
/// enumerates in, so a manifest's bytes depend only on its content. Keys are data (feature or
/// cohort names) and are written exactly, never renamed by the naming policy.
/// </summary>
internal sealed class OrdinalKeyDictionaryConverter<TDictionary, TValue> : JsonConverter<TDictionary>
    where TDictionary : IEnumerable<KeyValuePair<string, TValue>>
{
    public override TDictionary? Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        var entries = JsonSerializer.Deserialize<Dictionary<string, TValue>>(ref reader, options);
        if (entries is null) return default;
        if (typeToConvert == typeof(SortedDictionary<string, TValue>))
            return (TDictionary)(object)new SortedDictionary<string, TValue>(entries, StringComparer.Ordinal);
        return (TDictionary)(object)entries;
    }

    public override void Write(Utf8JsonWriter writer, TDictionary value, JsonSerializerOptions options)
    {
        var entries = new List<KeyValuePair<string, TValue>>(value);
        entries.Sort(static (a, b) => string.CompareOrdinal(a.Key, b.Key));
        writer.WriteStartObject();
        foreach (var entry in entries)
        {
            writer.WritePropertyName(entry.Key);
            JsonSerializer.Serialize(writer, entry.Value, options);
        }
        writer.WriteEndObject();
    }
}
