using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Serialization;
using System.Text.Json.Serialization.Metadata;

namespace OmicsScreen.Reporting.Json;

/// <summary>
/// Writes result manifests as JSON that is the same bytes for the same content: snake_case
/// property names, properties in ordinal order of their JSON names (an explicit
/// <see cref="JsonPropertyOrderAttribute"/> comes first), dictionary keys in ordinal order, numbers
/// in System.Text.Json's shortest round-trip form (culture-free by design), NaN and infinities as
/// null, enums as snake_case strings, two-space indentation and "\n" line ends with a final newline.
/// </summary>
public static class ManifestJson
{
    private static readonly UTF8Encoding Utf8WithoutMark = new(encoderShouldEmitUTF8Identifier: false);

    /// <summary>The serializer settings, for reading a manifest back with the same conventions.</summary>
    public static JsonSerializerOptions Options { get; } = CreateOptions();

    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Options) + "\n";

    /// <summary>Writes the manifest to <paramref name="writer"/> (which the caller owns, for example an atomic file writer).</summary>
    public static void Write<T>(TextWriter writer, T value)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Write(Serialize(value));
    }

    /// <summary>Writes the manifest as UTF-8 without a byte-order mark.</summary>
    public static void Write<T>(Stream stream, T value)
    {
        ArgumentNullException.ThrowIfNull(stream);
        var bytes = Utf8WithoutMark.GetBytes(Serialize(value));
        stream.Write(bytes);
    }

    public static T? Deserialize<T>(string json) => JsonSerializer.Deserialize<T>(json, Options);

    private static JsonSerializerOptions CreateOptions()
    {
        var options = new JsonSerializerOptions
        {
            PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
            WriteIndented = true,
            IndentSize = 2,
            NewLine = "\n",
            // Names from the data stay readable (non-ASCII letters kept as UTF-8). Quotes,
            // backslashes and control characters are still escaped as JSON requires; the manifest
            // is a file of its own and is never embedded in the HTML report.
            Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
            NumberHandling = JsonNumberHandling.Strict,
            TypeInfoResolver = new DefaultJsonTypeInfoResolver { Modifiers = { SortProperties } },
        };
        options.Converters.Add(new NonFiniteAsNullConverter());
        options.Converters.Add(new OrdinalKeyDictionaryConverterFactory());
        options.Converters.Add(new JsonStringEnumConverter(JsonNamingPolicy.SnakeCaseLower, allowIntegerValues: false));
        options.MakeReadOnly();
        return options;
    }

    // Reflection does not promise declaration order, so order is set here: explicit order first, then ordinal name.
    private static void SortProperties(JsonTypeInfo typeInfo)
    {
        if (typeInfo.Kind != JsonTypeInfoKind.Object || typeInfo.Properties.Count < 2) return;
        var properties = new List<JsonPropertyInfo>(typeInfo.Properties);
        properties.Sort(static (a, b) => a.Order != b.Order ? a.Order.CompareTo(b.Order) : string.CompareOrdinal(a.Name, b.Name));
        typeInfo.Properties.Clear();
        for (int i = 0; i < properties.Count; i++)
        {
            properties[i].Order = i;
            typeInfo.Properties.Add(properties[i]);
        }
    }
}
