using System.Text.Json.Nodes;
using OmicsScreen.Data;
using OmicsScreen.Runs.Locking;

namespace OmicsScreen.Runs.Tests.Locking;

public class LockedPanelEnvelopeTests
{
    private const string ChecksumMessage = "checksum does not match: the file was changed or truncated";

    /// <summary>Edge cases of float32: the largest, the smallest normal, the smallest subnormal, and values with long decimals.</summary>
    private static readonly float[] Thresholds = [12.345678f, float.MaxValue, 1.17549435E-38f, float.Epsilon, 0.1f, 1f / 3f, -2.5e-7f];

    private static JsonObject Content()
    {
        var thresholds = new JsonArray();
        foreach (float t in Thresholds) thresholds.Add(t);
        return new JsonObject
        {
            ["markers"] = new JsonArray("IL-6 (pg/mL)", "µ-globulin", "\"quoted\""),
            ["thresholds"] = thresholds,
            ["auc"] = 0.1 + 0.2,
        };
    }

    private static string Written(TempFolder folder, string name)
    {
        string path = folder.File(name);
        LockedPanelEnvelope.Write(path, Content());
        return path;
    }

    [Fact]
    public void Floats_and_text_round_trip_exactly()
    {
        using var folder = new TempFolder();
        string path = Written(folder, "model.json");
        var content = LockedPanelEnvelope.Read(path);
        var read = content["thresholds"]!.AsArray().Select(n => n!.GetValue<float>()).ToArray();
        Assert.Equal(Thresholds.Select(BitConverter.SingleToInt32Bits), read.Select(BitConverter.SingleToInt32Bits));
        Assert.Equal(BitConverter.DoubleToInt64Bits(0.1 + 0.2), BitConverter.DoubleToInt64Bits(content["auc"]!.GetValue<double>()));
        Assert.Equal("µ-globulin", content["markers"]![1]!.GetValue<string>());
        Assert.Equal("\"quoted\"", content["markers"]![2]!.GetValue<string>());
    }

    [Fact]
    public void The_file_is_indented_json_with_the_header_first()
    {
        using var folder = new TempFolder();
        string path = Written(folder, "model.json");
        var lines = File.ReadAllLines(path);
        Assert.Equal("{", lines[0]);
        Assert.Equal($"  \"format\": \"{LockedPanelEnvelope.FormatName}\",", lines[1]);
        Assert.Equal($"  \"version\": {LockedPanelEnvelope.FormatVersion},", lines[2]);
        Assert.Matches("^  \"content_sha256\": \"[0-9a-f]{64}\",$", lines[3]);
    }

    [Fact]
    public void A_truncated_file_fails_with_the_checksum_message_naming_the_file()
    {
        using var folder = new TempFolder();
        string path = Written(folder, "panel_a.json");
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(bytes.Length * 2 / 3)]);
        var error = Assert.Throws<PanelInputException>(() => LockedPanelEnvelope.Read(path));
        Assert.StartsWith("panel_a.json", error.Message);
        Assert.Contains(ChecksumMessage, error.Message);
    }

    [Fact]
    public void A_file_with_one_threshold_digit_changed_fails_with_the_checksum_message()
    {
        using var folder = new TempFolder();
        string path = Written(folder, "panel_b.json");
        string text = File.ReadAllText(path);
        Assert.Contains("12.345678", text);
        File.WriteAllText(path, text.Replace("12.345678", "12.345679"));
        var error = Assert.Throws<PanelInputException>(() => LockedPanelEnvelope.Read(path));
        Assert.StartsWith("panel_b.json", error.Message);
        Assert.Contains(ChecksumMessage, error.Message);
    }

    [Fact]
    public void Reformatting_whitespace_keeps_the_file_valid()
    {
        // The checksum covers the content's values, not the layout: re-indenting by hand is harmless.
        using var folder = new TempFolder();
        string path = Written(folder, "model.json");
        File.WriteAllText(path, File.ReadAllText(path).Replace("\n  ", "\n\t"));
        Assert.NotNull(LockedPanelEnvelope.Read(path));
    }

    [Fact]
    public void Text_that_is_not_json_is_refused_as_not_a_locked_panel()
    {
        using var folder = new TempFolder();
        string path = folder.File("matrix.csv", "sample_id,A\nS1,1\n");
        var error = Assert.Throws<PanelInputException>(() => LockedPanelEnvelope.Read(path));
        Assert.Equal("matrix.csv: is not a locked panel file: it is not JSON. Give the locked_panel.json of a screen's results folder.", error.Message);
    }

    [Fact]
    public void Json_of_another_format_is_refused_naming_both_formats()
    {
        using var folder = new TempFolder();
        string path = folder.File("manifest.json", "{\"format\": \"something-else\", \"version\": 1}");
        var error = Assert.Throws<PanelInputException>(() => LockedPanelEnvelope.Read(path));
        Assert.Contains("'something-else'", error.Message);
        Assert.Contains(LockedPanelEnvelope.FormatName, error.Message);
    }

    [Fact]
    public void A_newer_format_version_is_refused_as_unsupported()
    {
        using var folder = new TempFolder();
        string path = Written(folder, "model.json");
        // Version 2 is the measured and time-to-event panels' version; 3 is newer than this reader.
        File.WriteAllText(path, File.ReadAllText(path).Replace("\"version\": 1,", "\"version\": 3,"));
        var error = Assert.Throws<PanelInputException>(() => LockedPanelEnvelope.Read(path));
        Assert.Contains("format version 3", error.Message);
        Assert.Contains("reads versions up to 2", error.Message);
    }

    [Fact]
    public void A_decoder_failure_is_reported_naming_the_file()
    {
        using var folder = new TempFolder();
        string path = Written(folder, "model.json");
        var error = Assert.Throws<PanelInputException>(() =>
            LockedPanelEnvelope.Read<int>(path, _ => throw new InvalidDataException("forest[3]: Node 2 has a child out of range.")));
        Assert.StartsWith("model.json: the locked panel is not valid: forest[3]: Node 2 has a child out of range.", error.Message);
    }

    [Fact]
    public void A_missing_file_is_reported_as_missing()
    {
        using var folder = new TempFolder();
        var error = Assert.Throws<PanelInputException>(() => LockedPanelEnvelope.Read(folder.File("nothing.json")));
        Assert.Contains("does not exist", error.Message);
    }
}
