using System.Text.Json;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Support;

/// <summary>reference/survival/survival_reference.json: R survival package values (see the README there).</summary>
internal static class SurvivalReference
{
    private static readonly Lazy<JsonDocument> Shared = new(() =>
        JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "survival", "survival_reference.json"))));

    public static IEnumerable<object[]> DataSetNames() =>
        Shared.Value.RootElement.GetProperty("data_sets").EnumerateArray().Select(d => new object[] { d.GetProperty("name").GetString()! });

    public static ReferenceSet Get(string name)
    {
        var set = Shared.Value.RootElement.GetProperty("data_sets").EnumerateArray().Single(d => d.GetProperty("name").GetString() == name);
        return new ReferenceSet(set);
    }

    internal sealed class ReferenceSet(JsonElement element)
    {
        public JsonElement Element => element;
        public double[] Time => element.Doubles("time");
        public bool[] Event => element.Doubles("status").Select(v => v == 1).ToArray();
        public double[] Marker => element.Doubles("x");
        public double[] Doubles(string property) => element.Doubles(property);

        /// <summary>A scalar; R's jsonlite writes a length-one vector as a scalar and longer ones (log-likelihood pairs) as arrays.</summary>
        public double Number(string property) => element.GetProperty(property).GetDouble();
        public double[] Pair(string property) => element.Doubles(property);
        public long Count(string property) => element.GetProperty("concordance_count").GetProperty(property).GetInt64();
    }
}
