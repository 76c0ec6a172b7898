using System.Text.Json;
using Microsoft.Data.Analysis;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>The `screen` verb end to end: results folder, manifest, reruns and folder safety.</summary>
public sealed class ScreenCommandTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static readonly string[] QuickSettings =
        ["--pairs", "3", "--trees", "60", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "5", "--quiet"];

    private string[] ScreenWdbc(string outFolder, params string[] extra) =>
        ["screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--out", outFolder, .. QuickSettings, .. extra];

    [Fact]
    public void Screen_writes_the_documented_results_folder()
    {
        string results = Path.Combine(_folder.Path, "results");
        var run = CliHarness.Run(ScreenWdbc(results));

        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        foreach (var file in new[] { "shortlist.tsv", "features.tsv", "panel_size_curve.tsv", "marker_statistics.tsv", "manifest.json" })
            Assert.True(File.Exists(Path.Combine(results, file)), file);
        Assert.Equal(31, File.ReadAllLines(Path.Combine(results, "features.tsv")).Length);
        Assert.Contains("Shortlist:", run.Out);
        Assert.Contains("Panel-size curve:", run.Out);
        Assert.Contains("Locked panel:", run.Out);
        Assert.Contains("not a diagnostic test", run.Out);

        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(results, "manifest.json")));
        var root = manifest.RootElement;
        Assert.Equal("omicsscreen", root.GetProperty("tool").GetString());
        Assert.Equal(64, root.GetProperty("inputs")[0].GetProperty("sha256").GetString()!.Length);
        Assert.Equal(3, root.GetProperty("parameters").GetProperty("pairs").GetInt32());
        Assert.Contains("--pairs 3", root.GetProperty("command_line").GetString());
    }

    [Fact]
    public void The_manifest_command_line_reproduces_byte_identical_tables()
    {
        string first = Path.Combine(_folder.Path, "first");
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenWdbc(first)).ExitCode);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(first, "manifest.json")));
        string commandLine = manifest.RootElement.GetProperty("command_line").GetString()!;

        // Rerun the recorded command with only the output folder changed.
        string second = Path.Combine(_folder.Path, "second");
        var words = commandLine.Split(' ').Skip(1).Select(w => w == first ? second : w).ToArray();
        var rerun = CliHarness.Run(words);
        Assert.True(rerun.ExitCode == ExitCode.Success, rerun.Error);
        foreach (var table in new[] { "shortlist.tsv", "features.tsv", "panel_size_curve.tsv", "marker_statistics.tsv" })
            Assert.Equal(File.ReadAllBytes(Path.Combine(first, table)), File.ReadAllBytes(Path.Combine(second, table)));
    }

    [Fact]
    public void Screen_refuses_a_non_empty_folder_that_is_not_its_own()
    {
        string results = Path.Combine(_folder.Path, "busy");
        Directory.CreateDirectory(results);
        File.WriteAllText(Path.Combine(results, "thesis.docx"), "precious");
        var run = CliHarness.Run(ScreenWdbc(results));

        Assert.Equal(ExitCode.OutputError, run.ExitCode);
        Assert.Contains("--force", run.Error);
        Assert.Equal(["thesis.docx"], Directory.GetFiles(results).Select(Path.GetFileName));
    }

    [Fact]
    public void Screen_may_rerun_into_its_own_results_folder()
    {
        string results = Path.Combine(_folder.Path, "again");
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenWdbc(results)).ExitCode);
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenWdbc(results)).ExitCode);
    }

    [Fact]
    public void Progress_written_to_a_redirected_stream_holds_no_terminal_control_codes()
    {
        string results = Path.Combine(_folder.Path, "progress");
        var args = ScreenWdbc(results).Where(a => a != "--quiet").ToArray();
        var run = CliHarness.Run(args);
        Assert.Equal(ExitCode.Success, run.ExitCode);
        Assert.Contains("half-sample repeats", run.Error);
        Assert.DoesNotContain('\u001b', run.Error);
        Assert.DoesNotContain('\r', run.Error);
    }

    [Fact]
    public void Invalid_screen_settings_are_usage_errors()
    {
        var run = CliHarness.Run(ScreenWdbc(Path.Combine(_folder.Path, "x"), "--min-frequency", "0.4"));
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("frequency", run.Error);
        Assert.False(Directory.Exists(Path.Combine(_folder.Path, "x")));
    }

    [Fact]
    public void Result_tables_load_in_a_general_purpose_data_frame_with_numeric_columns()
    {
        // Microsoft.Data.Analysis DataFrame.LoadCsv, a general-purpose reader: the tables must load
        // with one row per record and their number columns typed as numbers, not text.
        string results = Path.Combine(_folder.Path, "frame");
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenWdbc(results)).ExitCode);

        var features = DataFrame.LoadCsv(Path.Combine(results, "features.tsv"), separator: '\t');
        Assert.Equal(30, features.Rows.Count);
        Assert.IsAssignableFrom<PrimitiveDataFrameColumn<float>>(features.Columns["selection_frequency"]);
        Assert.IsAssignableFrom<PrimitiveDataFrameColumn<float>>(features.Columns["q_value"]);

        var curve = DataFrame.LoadCsv(Path.Combine(results, "panel_size_curve.tsv"), separator: '\t');
        Assert.Equal(4, curve.Rows.Count); // sizes 1, 2, 3, 5
        Assert.Single(curve.Rows, row => (string)row[1] == "yes");
    }
}
