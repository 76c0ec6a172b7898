using System.Text.Json;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Support;

/// <summary>reference/stats/stats_reference.json: scipy and statsmodels values (see the README there).</summary>
internal static class StatsReference
{
    private static readonly Lazy<JsonDocument> Shared = new(() =>
        JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "stats", "stats_reference.json"))));

    public static JsonElement Root => Shared.Value.RootElement;

    public static JsonElement.ArrayEnumerator Block(string name) => Root.GetProperty(name).EnumerateArray();

    public static double[] Doubles(this JsonElement element, string property)
    {
        var array = element.GetProperty(property);
        var values = new double[array.GetArrayLength()];
        int i = 0;
        foreach (var item in array.EnumerateArray()) values[i++] = item.GetDouble();
        return values;
    }

    public static double Number(this JsonElement element, string property) => element.GetProperty(property).GetDouble();
}
