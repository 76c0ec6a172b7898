using System.Text.Json;
using System.Text.Json.Serialization;

namespace OmicsScreen.Reporting.Json;

/// <summary>
/// Writes a double as JSON's shortest round-trip number, and NaN or an infinity (which JSON cannot
/// hold) as null; reads null back as NaN.
/// </summary>
internal sealed class NonFiniteAsNullConverter : JsonConverter<double>
{
    public override bool HandleNull => true;

    public override double Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
        reader.TokenType == JsonTokenType.Null ? double.NaN : reader.GetDouble();

    public override void Write(Utf8JsonWriter writer, double value, JsonSerializerOptions options)
    {
        if (double.IsFinite(value)) writer.WriteNumberValue(value);
        else writer.WriteNullValue();
    }
}
