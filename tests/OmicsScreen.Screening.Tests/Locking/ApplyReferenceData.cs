using System.Text.Json;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Locking;

/// <summary>reference/apply/apply_reference.json (made by make_apply_reference.R with R's survival package and lm).</summary>
internal static class ApplyReferenceData
{
    private static readonly Lazy<JsonDocument> Document = new(() =>
        JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "apply", "apply_reference.json"))));

    public static JsonElement Root => Document.Value.RootElement;

    public static double[] LungTime => Doubles(Root.GetProperty("lung").GetProperty("time"));

    public static bool[] LungEvents => Root.GetProperty("lung").GetProperty("status").EnumerateArray().Select(e => e.GetInt32() == 1).ToArray();

    public static double[] LungMarker(string name) => Doubles(Root.GetProperty("lung").GetProperty("markers").GetProperty(name));

    public static double[] Doubles(JsonElement array) => array.EnumerateArray().Select(e => e.GetDouble()).ToArray();
}
