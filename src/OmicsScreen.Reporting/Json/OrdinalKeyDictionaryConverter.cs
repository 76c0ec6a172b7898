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
        // Read entry by entry: deserializing a Dictionary here would come back to this converter.
        if (reader.TokenType == JsonTokenType.Null) return default;
        if (reader.TokenType != JsonTokenType.StartObject) throw new JsonException("A dictionary must be a JSON object.");
        var entries = new Dictionary<string, TValue>(StringComparer.Ordinal);
        while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
        {
            string key = reader.GetString() ?? throw new JsonException("A dictionary key is null.");
            reader.Read();
            entries[key] = JsonSerializer.Deserialize<TValue>(ref reader, options)!;
        }
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
