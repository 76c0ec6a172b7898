using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Tests.Support;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Reporting.Tests.Json;

public class ManifestJsonTests
{
    private sealed record Settings(int TreeCount, double MinimumFrequency, string Zeta, double Alpha, ScoreDirection Direction,
        IReadOnlyDictionary<string, double> Seeds);

    private static Settings Sample() => new(500, 0.6, "\u00C5ngstr\u00F6m-\u03B2 \"q\"", double.NaN, ScoreDirection.HigherIsBetter,
        new Dictionary<string, double> { ["b"] = 2, ["a"] = 0.1, ["B"] = 1e-300 });

    [Fact]
    public void Properties_are_snake_case_in_ordinal_order_and_dictionary_keys_are_sorted()
    {
        string json = ManifestJson.Serialize(Sample());
        string expected = "{\n"
            + "  \"alpha\": null,\n"
            + "  \"direction\": \"higher_is_better\",\n"
            + "  \"minimum_frequency\": 0.6,\n"
            + "  \"seeds\": {\n"
            + "    \"B\": 1E-300,\n"
            + "    \"a\": 0.1,\n"
            + "    \"b\": 2\n"
            + "  },\n"
            + "  \"tree_count\": 500,\n"
            + "  \"zeta\": \"\u00C5ngstr\u00F6m-\u03B2 \\\"q\\\"\"\n"
            + "}\n";
        Assert.Equal(expected, json);
    }

    [Fact]
    public void Output_is_identical_across_calls_and_current_cultures()
    {
        string first = ManifestJson.Serialize(Sample());
        using var _ = CultureScope.CommaDecimal();
        Assert.Equal(first, ManifestJson.Serialize(Sample()));
    }

    [Fact]
    public void A_manifest_reads_back_with_NaN_for_null()
    {
        var back = ManifestJson.Deserialize<Settings>(ManifestJson.Serialize(Sample()))!;
        Assert.True(double.IsNaN(back.Alpha));
        Assert.Equal(0.6, back.MinimumFrequency);
        Assert.Equal(1e-300, back.Seeds["B"]);
        Assert.Equal(ScoreDirection.HigherIsBetter, back.Direction);
    }

    [Fact]
    public void Stream_output_is_utf8_without_a_byte_order_mark()
    {
        using var stream = new MemoryStream();
        ManifestJson.Write(stream, Sample());
        var bytes = stream.ToArray();
        Assert.Equal((byte)'{', bytes[0]);
        Assert.Equal(ManifestJson.Serialize(Sample()), System.Text.Encoding.UTF8.GetString(bytes));
    }
}
