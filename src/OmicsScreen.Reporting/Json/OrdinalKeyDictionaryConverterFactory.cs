using System.Text.Json;
using System.Text.Json.Serialization;

namespace OmicsScreen.Reporting.Json;

/// <summary>
/// Supplies <see cref="OrdinalKeyDictionaryConverter{TDictionary, TValue}"/> for Dictionary,
/// SortedDictionary, IDictionary and IReadOnlyDictionary with string keys.
/// </summary>
internal sealed class OrdinalKeyDictionaryConverterFactory : JsonConverterFactory
{
    public override bool CanConvert(Type typeToConvert) => ValueType(typeToConvert) is not null;

    public override JsonConverter? CreateConverter(Type typeToConvert, JsonSerializerOptions options)
    {
        var valueType = ValueType(typeToConvert) ?? throw new NotSupportedException($"{typeToConvert} is not a string-keyed dictionary.");
        var converterType = typeof(OrdinalKeyDictionaryConverter<,>).MakeGenericType(typeToConvert, valueType);
        return (JsonConverter?)Activator.CreateInstance(converterType);
    }

    private static Type? ValueType(Type type)
    {
        if (!type.IsGenericType) return null;
        var definition = type.GetGenericTypeDefinition();
        bool dictionary = definition == typeof(Dictionary<,>) || definition == typeof(SortedDictionary<,>)
            || definition == typeof(IDictionary<,>) || definition == typeof(IReadOnlyDictionary<,>);
        if (!dictionary) return null;
        var arguments = type.GetGenericArguments();
        return arguments[0] == typeof(string) ? arguments[1] : null;
    }
}
