using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Locking;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// `omicsscreen apply` on the Wisconsin breast cancer data (reference/wdbc, UCI), split into
/// train and test rows by wdbc_split.csv: a panel locked on the train rows scores the test rows.
/// </summary>
public class ApplyCommandTests
{
    private static readonly string[] Markers = ["worst_perimeter", "worst_concave_points", "mean_concave_points", "worst_radius", "worst_area"];

    private static readonly Lazy<LockedPanel> TrainPanel = new(LockOnTrainRows);

    [Fact]
    public void A_panel_locked_on_one_half_separates_the_other_half_and_writes_every_output()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        string test = folder.File("test.csv", WdbcRows("test"));
        string results = Path.Combine(folder.Path, "applied");
        var run = CliHarness.Run("apply", model, test, "--outcome", "diagnosis", "--out", results);
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        foreach (var file in new[] { "scores.tsv", "evaluation.json", "calibration.tsv", "confusion.tsv", "apply_report.html", "manifest.json" })
            Assert.True(File.Exists(Path.Combine(results, file)), file);

        var evaluation = JsonNode.Parse(File.ReadAllText(Path.Combine(results, "evaluation.json")))!;
        // rf_summary.json "holdout": scikit-learn forests on all 30 features, same test rows, accuracy 0.944;
        // a different forest on five markers, so compared loosely: AUC well above 0.5, error near 0.06.
        Assert.InRange(evaluation["auc"]!.GetValue<double>(), 0.95, 1.0);
        Assert.InRange(evaluation["error"]!.GetValue<double>(), 0.0, 0.12);
        Assert.True(evaluation["auc_interval"]!["lower"]!.GetValue<double>() > 0.9);
        var scoreLines = File.ReadAllLines(Path.Combine(results, "scores.tsv"));
        Assert.Equal("sample_id\tprobability_benign\tprobability_malignant\tcalled_class\tknown_class", scoreLines[0]);
        Assert.Equal(172, scoreLines.Length);
        var confusion = File.ReadAllLines(Path.Combine(results, "confusion.tsv"));
        Assert.Equal("known_class\tcalled_benign\tcalled_malignant", confusion[0]);
        Assert.Contains("AUC 0.9", run.Out);
        Assert.Contains("Error at the locked call", run.Out);
    }

    [Fact]
    public void A_saved_and_reloaded_model_gives_exactly_the_probabilities_of_the_model_it_was_saved_from()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        var reloaded = LockedPanelFile.Read(model);
        var (matrix, _) = WdbcData.Load();
        var before = LockedPanelScorer.Score(TrainPanel.Value, matrix);
        var after = LockedPanelScorer.Score(reloaded, matrix);
        Assert.Equal(before.Probabilities.Select(BitConverter.DoubleToInt64Bits), after.Probabilities.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(before.PredictedClasses, after.PredictedClasses);

        // The scores file holds round-trip digits: parsing it gives the same doubles again.
        string results = Path.Combine(folder.Path, "applied");
        string all = folder.File("all.csv", WdbcRows(null));
        Assert.Equal(ExitCode.Success, CliHarness.Run("apply", model, all, "--outcome", "diagnosis", "--out", results).ExitCode);
        var lines = File.ReadAllLines(Path.Combine(results, "scores.tsv"));
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            var fields = lines[s + 1].Split('\t');
            Assert.Equal(matrix.SampleIds[s], fields[0]);
            Assert.Equal(before.Probability(s, 1), double.Parse(fields[2], CultureInfo.InvariantCulture));
        }
    }

    [Fact]
    public void A_panel_missing_markers_fails_with_an_input_error_naming_every_one()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        var run = ApplyToTestRows(folder, model, WdbcRows("test", drop: ["worst_radius", "mean_concave_points"]));
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("test.csv", run.Error);
        Assert.Contains("worst_radius", run.Error);
        Assert.Contains("mean_concave_points", run.Error);
        Assert.False(Directory.Exists(Path.Combine(folder.Path, "applied")));
    }

    [Fact]
    public void A_measured_outcome_is_refused_before_anything_is_written()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        string test = folder.File("test.csv", WdbcRows("test", drop: ["diagnosis"]));
        var ids = File.ReadAllLines(test).Skip(1).Select(line => line.Split(',')[0]).ToArray();
        // An invented score with a different value per sample: read as a measured quantity.
        string sheet = folder.File("sheet.csv", "sample_id,score\n" + string.Concat(ids.Select((id, i) => FormattableString.Invariant($"{id},{i * 0.37 + 2}\n"))));
        string results = Path.Combine(folder.Path, "applied");
        var run = CliHarness.Run("apply", model, test, "--samples", sheet, "--outcome", "score", "--out", results);
        Assert.Equal(ExitCode.NotScreenable, run.ExitCode);
        Assert.Contains("'score' is a measured quantity", run.Error);
        Assert.Contains("omicsscreen check", run.Error);
        Assert.False(Directory.Exists(results));
    }

    [Fact]
    public void Without_an_outcome_samples_are_scored_and_nothing_is_evaluated()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        string test = folder.File("test.csv", WdbcRows("test", drop: ["diagnosis"]));
        string results = Path.Combine(folder.Path, "applied");
        var run = CliHarness.Run("apply", model, test, "--out", results);
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Equal(172, File.ReadAllLines(Path.Combine(results, "scores.tsv")).Length);
        Assert.False(File.Exists(Path.Combine(results, "evaluation.json")));
        Assert.Contains("No outcome was given", File.ReadAllText(Path.Combine(results, "apply_report.html")));
    }

    [Fact]
    public void A_truncated_model_fails_with_the_checksum_message()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        var bytes = File.ReadAllBytes(model);
        File.WriteAllBytes(model, bytes[..(bytes.Length / 2)]);
        var run = ApplyToTestRows(folder, model);
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("locked_panel.json", run.Error);
        Assert.Contains("checksum does not match: the file was changed or truncated", run.Error);
    }

    [Fact]
    public void A_model_with_one_threshold_digit_changed_fails_with_the_checksum_message()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        var document = JsonNode.Parse(File.ReadAllText(model))!;
        // The first split threshold of the first tree, as written, with its last digit changed.
        string written = document["content"]!["forest"]![0]!["thresholds"]![0]!.ToJsonString();
        char last = written[^1];
        string edited = written[..^1] + (last == '9' ? '8' : (char)(last + 1));
        string text = File.ReadAllText(model);
        int at = text.IndexOf("\"thresholds\": [", StringComparison.Ordinal);
        at = text.IndexOf(written, at, StringComparison.Ordinal);
        File.WriteAllText(model, text[..at] + edited + text[(at + written.Length)..]);
        var run = ApplyToTestRows(folder, model);
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("checksum does not match: the file was changed or truncated", run.Error);
    }

    [Fact]
    public void A_model_whose_trees_are_structurally_invalid_is_refused_by_name()
    {
        using var folder = new TempFolder();
        var content = LockedPanelJson.ToJson(TrainPanel.Value);
        content["forest"]![2]!["right"]!.AsArray()[0] = 100000;
        // Written through the file writer, so the checksum is right and only the structure is wrong.
        string model = Path.Combine(folder.Path, "broken.json");
        LockedPanelEnvelope.Write(model, content);
        var run = ApplyToTestRows(folder, model);
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("broken.json: the locked panel is not valid: forest[2]", run.Error);
    }

    [Fact]
    public void A_marker_in_other_units_is_warned_about()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        var run = ApplyToTestRows(folder, model, WdbcRows("test", scale: ("worst_area", 1000)));
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Contains("warning: worst_area looks measured on another scale", run.Error);
        Assert.DoesNotContain("worst_radius looks", run.Error);
    }

    [Fact]
    public void The_report_shows_sample_ids_only_when_asked()
    {
        using var folder = new TempFolder();
        string model = WriteModel(folder);
        string test = folder.File("test.csv", WdbcRows("test"));
        string firstId = WdbcRows("test").Split('\n')[1].Split(',')[0];
        string hidden = Path.Combine(folder.Path, "hidden");
        string shown = Path.Combine(folder.Path, "shown");
        Assert.Equal(ExitCode.Success, CliHarness.Run("apply", model, test, "--outcome", "diagnosis", "--out", hidden).ExitCode);
        Assert.Equal(ExitCode.Success, CliHarness.Run("apply", model, test, "--outcome", "diagnosis", "--out", shown, "--show-sample-ids").ExitCode);
        Assert.DoesNotContain(firstId, File.ReadAllText(Path.Combine(hidden, "apply_report.html")));
        Assert.Contains(firstId, File.ReadAllText(Path.Combine(shown, "apply_report.html")));
        // The scores table is the user's own output and always carries the ids.
        Assert.Contains(firstId, File.ReadAllText(Path.Combine(hidden, "scores.tsv")));
    }

    [Fact]
    public void A_screen_results_folder_gets_a_locked_panel_the_apply_verb_reads()
    {
        using var folder = new TempFolder();
        string train = folder.File("train.csv", WdbcRows("train"));
        var loaded = Data.PanelLoader.Load(new Data.PanelLoadOptions { MatrixPath = train, OutcomeColumn = "diagnosis" });
        var result = Screening.Screen.ScreenRunner.Run(loaded.Panel,
            new Screening.Screen.ScreenOptions { Seed = 5, HalfSamplePairs = 2, TreesPerForest = 40, CurveFolds = 0 });
        string results = Path.Combine(folder.Path, "screen");
        Directory.CreateDirectory(results);
        Assert.Equal("locked_panel.json", PanelLocking.LockInto(results, loaded, result, panelSize: 3));

        var locked = LockedPanelFile.Read(Path.Combine(results, "locked_panel.json"));
        Assert.Equal(result.Order.Take(3).Select(f => loaded.Panel.Matrix.FeatureNames[f]), locked.MarkerNames);
        Assert.Equal(40, locked.Trees.Count);
        Assert.Equal(5UL, locked.Provenance.Seed);
        // The discovery input is named with the SHA-256 the loader recorded.
        Assert.Equal(loaded.Inputs[0].Sha256, locked.Provenance.InputSha256["train.csv"]);
        var run = CliHarness.Run("apply", Path.Combine(results, "locked_panel.json"), folder.File("test.csv", WdbcRows("test")),
            "--outcome", "diagnosis", "--out", Path.Combine(folder.Path, "applied"));
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
    }

    [Fact]
    public void Apply_has_help()
    {
        var run = CliHarness.Run("apply", "--help");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        Assert.Contains("MODEL", run.Out);
        Assert.Contains("--show-sample-ids", run.Out);
    }

    /// <summary>Runs apply with the model on the test rows (or the given matrix text), outcome known, into "applied".</summary>
    private static CliHarness.Outcome ApplyToTestRows(TempFolder folder, string model, string? matrixText = null) =>
        CliHarness.Run("apply", model, folder.File("test.csv", matrixText ?? WdbcRows("test")), "--outcome", "diagnosis",
            "--out", Path.Combine(folder.Path, "applied"));

    private static string WriteModel(TempFolder folder) => LockedPanelFile.WriteInto(folder.Path, TrainPanel.Value);

    private static LockedPanel LockOnTrainRows()
    {
        var (matrix, outcome) = WdbcData.Load();
        var set = Split();
        var train = Enumerable.Range(0, matrix.SampleCount).Where(s => set[matrix.SampleIds[s]] == "train").ToArray();
        var panel = new Panel(matrix, outcome).SelectSamples(train);
        var markers = Markers.Select(name => matrix.FeatureNames.ToList().IndexOf(name)).ToArray();
        return PanelLocker.Lock(panel, markers, new ForestOptions { TreeCount = 150, Seed = 11, Repeat = PanelLocker.LockRepeat },
            new PanelLockOptions { Seed = 11, TreeCount = 150, ToolVersion = "test" });
    }

    private static Dictionary<string, string> Split() =>
        WdbcData.ReadTable("wdbc_split.csv").ToDictionary(r => r["sample_id"], r => r["set"]);

    /// <summary>wdbc.csv rows of one set (null for all), optionally without some columns or with one column rescaled.</summary>
    private static string WdbcRows(string? set, string[]? drop = null, (string Column, float Factor)? scale = null)
    {
        var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv"));
        var header = lines[0].Split(',');
        var keep = Enumerable.Range(0, header.Length).Where(c => drop is null || !drop.Contains(header[c])).ToArray();
        int scaled = scale is { } s ? Array.IndexOf(header, s.Column) : -1;
        var split = Split();
        var text = new System.Text.StringBuilder();
        text.Append(string.Join(',', keep.Select(c => header[c]))).Append('\n');
        foreach (var line in lines.Skip(1))
        {
            var fields = line.Split(',');
            if (set is not null && split[fields[0]] != set) continue;
            if (scaled >= 0)
                fields[scaled] = (float.Parse(fields[scaled], CultureInfo.InvariantCulture) * scale!.Value.Factor).ToString("R", CultureInfo.InvariantCulture);
            text.Append(string.Join(',', keep.Select(c => fields[c]))).Append('\n');
        }
        return text.ToString();
    }
}
