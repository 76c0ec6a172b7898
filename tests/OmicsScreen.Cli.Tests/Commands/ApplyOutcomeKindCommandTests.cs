using System.Text;
using System.Text.Json;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// The whole path for a measured and a time-to-event outcome: `screen` locks a panel, `apply`
/// scores a fresh cohort drawn from the same invented model and measures it. Invented panels: 30
/// features (value 5 + z), the outcome = z0 + 0.8 z1 + noise, or exponential event times with log
/// hazard 0.9 z0 + 0.8 z1 and exponential censoring; the answer is known by construction.
/// </summary>
public sealed class ApplyOutcomeKindCommandTests : IDisposable
{
    /// <summary>A feature name with markup, to prove names are escaped in the report.</summary>
    private const string HostileMarker = "<i>SIM001</i>";

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private (string Matrix, string Sheet) Cohort(string name, ulong seed, int samples, string idPrefix, bool hostileId = false)
    {
        const int features = 30;
        var generator = SeedSchedule.Generator(seed, 0, 0, SeedPurpose.Sampling);
        var z = new double[features];
        var matrix = new StringBuilder("sample_id");
        for (int f = 0; f < features; f++) matrix.Append(',').Append(f == 1 ? HostileMarker : FormattableString.Invariant($"SIM{f:D3}"));
        matrix.Append('\n');
        var sheet = new StringBuilder("sample_id,score,months,relapse\n");
        for (int s = 0; s < samples; s++)
        {
            // One id that a spreadsheet would run as a formula, to prove tables neutralise it.
            string id = hostileId && s == 0 ? "=1+1" : FormattableString.Invariant($"{idPrefix}{s:D3}");
            matrix.Append(id);
            for (int f = 0; f < features; f++)
            {
                z[f] = generator.NextGaussian();
                matrix.Append(FormattableString.Invariant($",{5 + z[f]:0.0000}"));
            }
            matrix.Append('\n');
            double score = z[0] + 0.8 * z[1] + 0.7 * generator.NextGaussian();
            double eventTime = -Math.Log(1 - generator.NextDouble()) / Math.Exp(0.9 * z[0] + 0.8 * z[1]);
            double censorTime = -Math.Log(1 - generator.NextDouble()) / 0.4;
            sheet.Append(FormattableString.Invariant($"{id},{score:0.0000},{Math.Min(eventTime, censorTime):0.0000},{(eventTime <= censorTime ? 1 : 0)}\n"));
        }
        return (_folder.File(name + ".csv", matrix.ToString()), _folder.File(name + "_samples.csv", sheet.ToString()));
    }

    private static string[] OutcomeOptions(bool followUp) => followUp ? ["--follow-up", "months", "--event", "relapse"] : ["--outcome", "score"];

    private string Screen(bool followUp, string folderName, string? threads = null)
    {
        var (matrix, sheet) = Cohort("discovery", 77, 140, "D");
        string output = Path.Combine(_folder.Path, folderName);
        var run = CliHarness.Run(["screen", matrix, "--samples", sheet, .. OutcomeOptions(followUp), "--pairs", "5", "--trees", "100",
            "--curve-folds", "3", "--curve-inner-pairs", "2", .. (threads is null ? Array.Empty<string>() : ["--threads", threads]),
            "--out", output, "--quiet", "--json"]);
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        using var headline = JsonDocument.Parse(run.Out);
        string model = headline.RootElement.GetProperty("locked_panel_file").GetString()!;
        Assert.Equal(Path.Combine(output, "locked_panel.json"), model);
        Assert.True(File.Exists(model));
        return model;
    }

    [Theory]
    [InlineData("measured")]
    [InlineData("time")]
    public void A_panel_locked_by_screen_scores_a_fresh_cohort_from_the_same_model(string kind)
    {
        bool followUp = kind == "time";
        string model = Screen(followUp, "screen-" + kind);
        string screenFolder = Path.GetDirectoryName(model)!;
        double selectionAware;
        using (var screenManifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(screenFolder, "manifest.json"))))
        {
            Assert.Contains(screenManifest.RootElement.GetProperty("outputs").EnumerateArray(), o => o.GetString() == "locked_panel.json");
            selectionAware = screenManifest.RootElement.GetProperty("results").GetProperty("locked_panel_selection_aware_estimate").GetDouble();
        }
        string screenReport = File.ReadAllText(Path.Combine(screenFolder, "report.html"));
        Assert.Contains("The panel locked for", screenReport);
        Assert.Contains(followUp ? "not a calibrated survival probability" : "R², RMSE and the calibration line", screenReport);
        var stored = LockedPanelFile.ReadAny(model);
        Assert.Equal(followUp ? OutcomeKind.TimeToEvent : OutcomeKind.Measured, stored.Kind);
        // The planted markers lead the shortlist, so the locked panel holds one or both of them and nothing else.
        Assert.All(stored.MarkerNames, marker => Assert.Contains(marker, new[] { "SIM000", HostileMarker }));
        Assert.Contains(HostileMarker, stored.MarkerNames);

        var (matrix, sheet) = Cohort("fresh", 4242, 200, "F", hostileId: true);
        string applied = Path.Combine(_folder.Path, "applied-" + kind);
        string[] horizon = followUp ? ["--horizon", "1"] : [];
        var run = CliHarness.Run(["apply", model, matrix, "--samples", sheet, .. OutcomeOptions(followUp), .. horizon, "--out", applied]);
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);

        var files = followUp
            ? new[] { "scores.tsv", "evaluation.json", "risk_groups.tsv", "apply_report.html", "manifest.json" }
            : new[] { "scores.tsv", "evaluation.json", "calibration.tsv", "apply_report.html", "manifest.json" };
        foreach (var file in files) Assert.True(File.Exists(Path.Combine(applied, file)), file);
        Assert.False(File.Exists(Path.Combine(applied, "confusion.tsv")));

        var scores = File.ReadAllLines(Path.Combine(applied, "scores.tsv"));
        Assert.Equal(followUp ? "sample_id\trisk_score\trisk_group\tfollow_up_time\tevent" : "sample_id\tpredicted\tobserved", scores[0]);
        Assert.Equal(201, scores.Length);
        Assert.StartsWith("'=1+1\t", scores[1]);

        using var evaluation = JsonDocument.Parse(File.ReadAllText(Path.Combine(applied, "evaluation.json")));
        var root = evaluation.RootElement;
        if (followUp)
        {
            // Well above chance, and near the screen's selection-aware estimate of the locking
            // procedure (issue 18 asks for 0.05 on average over panels; one small panel gets 0.1).
            double c = root.GetProperty("concordance").GetProperty("estimate").GetDouble();
            Assert.InRange(c, 0.55, 0.9);
            Assert.True(root.GetProperty("concordance").GetProperty("lower").GetDouble() > 0.5);
            Assert.True(Math.Abs(c - selectionAware) < 0.1, $"fresh C {c:0.000}, selection-aware {selectionAware:0.000}");
            var auc = root.GetProperty("time_dependent_auc");
            Assert.Equal(1.0, auc.GetProperty("horizon").GetDouble());
            Assert.InRange(auc.GetProperty("auc").GetDouble(), 0.55, 0.95);
            Assert.True(root.GetProperty("log_rank_p").GetDouble() < 0.05);
            Assert.Contains("Concordance (Harrell's C)", run.Out);
            Assert.Contains("Time-dependent AUC at 1", run.Out);
        }
        else
        {
            // Var(score) = 1 + 0.64 + 0.49 = 2.13 of which 1.64 is explained: a perfect model's R² is 0.77.
            double rSquared = root.GetProperty("r_squared").GetDouble();
            Assert.InRange(rSquared, 0.35, 0.8);
            Assert.True(Math.Abs(rSquared - selectionAware) < 0.15, $"fresh R² {rSquared:0.000}, selection-aware {selectionAware:0.000}");
            var slope = root.GetProperty("calibration_slope");
            Assert.True(slope.GetProperty("lower").GetDouble() < slope.GetProperty("estimate").GetDouble());
            Assert.InRange(slope.GetProperty("estimate").GetDouble(), 0.7, 1.8);
            Assert.Contains("Calibration (observed on predicted): slope", run.Out);
        }

        string report = File.ReadAllText(Path.Combine(applied, "apply_report.html"));
        Assert.Contains("&lt;i&gt;SIM001&lt;/i&gt;", report);
        Assert.DoesNotContain(HostileMarker, report);
        Assert.DoesNotContain("F001", report);
        Assert.Contains("<svg", report);
        Assert.Contains(followUp ? "not a calibrated probability" : "Perfect calibration", report);

        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(applied, "manifest.json")));
        Assert.Equal(followUp ? "time_to_event" : "measured", manifest.RootElement.GetProperty("model").GetProperty("outcome_kind").GetString());
        Assert.Equal(files.Length - 1, manifest.RootElement.GetProperty("outputs").GetArrayLength());

        // Without the outcome: scored only.
        string scoredOnly = Path.Combine(_folder.Path, "scored-" + kind);
        var unknown = CliHarness.Run("apply", model, matrix, "--out", scoredOnly, "--json");
        Assert.True(unknown.ExitCode == ExitCode.Success, unknown.Error);
        Assert.False(File.Exists(Path.Combine(scoredOnly, "evaluation.json")));
        using var headline = JsonDocument.Parse(unknown.Out);
        Assert.Equal(followUp ? "time_to_event" : "measured", headline.RootElement.GetProperty("outcome_kind").GetString());
        Assert.Equal(200, headline.RootElement.GetProperty("samples").GetInt32());
    }

    [Fact]
    public void Wrong_kinds_and_a_horizon_the_cohort_cannot_support_are_refused_before_anything_is_written()
    {
        string model = Screen(followUp: true, "screen-refusals");
        var (matrix, sheet) = Cohort("fresh", 4242, 120, "F");
        string output = Path.Combine(_folder.Path, "refused");

        var beyond = CliHarness.Run("apply", model, matrix, "--samples", sheet, "--follow-up", "months", "--event", "relapse", "--horizon", "1000", "--out", output);
        Assert.Equal(ExitCode.InputError, beyond.ExitCode);
        Assert.Contains("--horizon 1000: the horizon 1000 is at or beyond the last follow-up time", beyond.Error);
        var early = CliHarness.Run("apply", model, matrix, "--samples", sheet, "--follow-up", "months", "--event", "relapse", "--horizon", "0.00001", "--out", output);
        Assert.Equal(ExitCode.InputError, early.ExitCode);
        Assert.Contains("no event happened by the horizon", early.Error);

        var outcome = CliHarness.Run("apply", model, matrix, "--samples", sheet, "--outcome", "score", "--out", output);
        Assert.Equal(ExitCode.Usage, outcome.ExitCode);
        Assert.Contains("is a panel locked on a time to an event", outcome.Error);
        Assert.Contains("--follow-up and --event instead of --outcome", outcome.Error);

        var noFollowUp = CliHarness.Run("apply", model, matrix, "--horizon", "1", "--out", output);
        Assert.Equal(ExitCode.Usage, noFollowUp.ExitCode);
        Assert.Contains("--horizon needs the cohort's follow-up", noFollowUp.Error);

        // A class panel (locked here on classes drawn from the score) given follow-up or a measured column.
        var classModel = ClassModel(matrix, sheet);
        var classFollowUp = CliHarness.Run("apply", classModel, matrix, "--samples", sheet, "--follow-up", "months", "--event", "relapse", "--out", output);
        Assert.Equal(ExitCode.Usage, classFollowUp.ExitCode);
        Assert.Contains("is a panel locked on classes", classFollowUp.Error);
        var classMeasured = CliHarness.Run("apply", classModel, matrix, "--samples", sheet, "--outcome", "score", "--out", output);
        Assert.Equal(ExitCode.NotScreenable, classMeasured.ExitCode);
        Assert.Contains("the outcome 'score' is a measured quantity, but class_panel.json is a panel locked on classes", classMeasured.Error);
        Assert.DoesNotContain("   at ", classMeasured.Error);
        Assert.False(Directory.Exists(output));
    }

    [Fact]
    public void A_measured_panel_refuses_follow_up_options_and_a_column_of_text()
    {
        string model = Screen(followUp: false, "screen-measured-refusals");
        var (matrix, _) = Cohort("fresh", 4242, 60, "F");
        var ids = File.ReadAllLines(matrix).Skip(1).Select(line => line.Split(',')[0]).ToArray();
        string sheet = _folder.File("text.csv", "sample_id,score\n" + string.Concat(ids.Select((id, i) => $"{id},{(i % 2 == 0 ? "high" : "low")}\n")));
        string output = Path.Combine(_folder.Path, "refused");

        var followUp = CliHarness.Run("apply", model, matrix, "--samples", sheet, "--follow-up", "months", "--event", "relapse", "--out", output);
        Assert.Equal(ExitCode.Usage, followUp.ExitCode);
        Assert.Contains("is a panel locked on a measured outcome", followUp.Error);
        var text = CliHarness.Run("apply", model, matrix, "--samples", sheet, "--outcome", "score", "--out", output);
        Assert.NotEqual(ExitCode.Success, text.ExitCode);
        Assert.Contains("text.csv", text.Error);
        Assert.DoesNotContain("   at ", text.Error);
        Assert.False(Directory.Exists(output));
    }

    /// <summary>1 and 2 threads give the same locked-panel file, to the byte (the forest draws from (seed, repeat, tree) only).</summary>
    [Fact]
    public void One_and_two_threads_write_the_same_locked_panel_file()
    {
        string one = Screen(followUp: true, "threads-1", threads: "1");
        string two = Screen(followUp: true, "threads-2", threads: "2");
        Assert.Equal(File.ReadAllBytes(one), File.ReadAllBytes(two));
    }

    private string ClassModel(string matrixPath, string sheetPath)
    {
        var matrixLines = File.ReadAllLines(matrixPath);
        var sheetLines = File.ReadAllLines(sheetPath);
        var names = matrixLines[0].Split(',')[1..];
        var builder = new FeatureMatrixBuilder(names, matrixLines.Skip(1).Select(l => l.Split(',')[0]).ToArray());
        var classes = new int[matrixLines.Length - 1];
        for (int s = 0; s < classes.Length; s++)
        {
            var cells = matrixLines[s + 1].Split(',');
            for (int f = 0; f < names.Length; f++) builder.SetMeasured(f, s, float.Parse(cells[f + 1], System.Globalization.CultureInfo.InvariantCulture));
            classes[s] = double.Parse(sheetLines[s + 1].Split(',')[1], System.Globalization.CultureInfo.InvariantCulture) > 0 ? 1 : 0;
        }
        var panel = new Panel(builder.Build(), new ClassOutcome("status", ["low", "high"], classes));
        var locked = PanelLocker.Lock(panel, [0, 1], new() { TreeCount = 20, Seed = 3, Repeat = PanelLocker.LockRepeat }, new PanelLockOptions { Seed = 3, TreeCount = 20 });
        string path = Path.Combine(_folder.Path, "class_panel.json");
        LockedPanelFile.Write(path, locked);
        return path;
    }
}
