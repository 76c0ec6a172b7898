using System.Globalization;
using System.Text;
using System.Text.Json;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>What `screen` says and writes about its error control, through the command line.</summary>
public sealed class ErrorControlCommandTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>A panel with no feature related to the outcome (CausalBlockPanel's null design), as CSV.</summary>
    private string NullPanelCsv()
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { Null = true, SampleCount = 60, FeatureCount = 120, Seed = 17 });
        var text = new StringBuilder("sample_id,status," + string.Join(",", panel.Matrix.FeatureNames) + "\n");
        for (int s = 0; s < panel.SampleCount; s++)
        {
            text.Append(panel.Matrix.SampleIds[s]).Append(',').Append(panel.Outcome.ClassNames[panel.Outcome.SampleClasses[s]]);
            for (int f = 0; f < panel.FeatureCount; f++)
                text.Append(',').Append(panel.Matrix.Value(f, s).ToString("R", CultureInfo.InvariantCulture));
            text.Append('\n');
        }
        return _folder.File("null_panel.csv", text.ToString());
    }

    [Fact]
    public void An_empty_shortlist_locks_no_panel_and_says_why()
    {
        string results = Path.Combine(_folder.Path, "results");
        var run = CliHarness.Run("screen", NullPanelCsv(), "--outcome", "status", "--out", results,
            "--pairs", "3", "--trees", "60", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "5", "--decoys", "300");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Contains("Shortlist: empty", run.Out);
        Assert.Contains("No panel locked: no marker passed error control", run.Out);
        Assert.False(File.Exists(Path.Combine(results, "locked_panel.json")));
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(results, "manifest.json")));
        var outcome = manifest.RootElement.GetProperty("results");
        Assert.Equal(0, outcome.GetProperty("shortlisted").GetInt32());
        Assert.Equal(0, outcome.GetProperty("locked_panel_size").GetInt32());
        Assert.Contains("No panel locked", File.ReadAllText(Path.Combine(results, "report.html")));
    }

    [Fact]
    public void The_console_states_the_expected_number_of_false_markers_and_how_it_was_estimated()
    {
        string results = Path.Combine(_folder.Path, "wdbc");
        var run = CliHarness.Run("screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--out", results,
            "--pairs", "3", "--trees", "60", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "8", "--decoys", "300");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Contains("Expected false markers on this list of", run.Out);
        Assert.Contains("each permuted once per run", run.Out);
        Assert.Contains("Locked panel:", run.Out);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(results, "manifest.json")));
        var outcome = manifest.RootElement.GetProperty("results");
        int listed = outcome.GetProperty("shortlisted").GetInt32();
        int locked = outcome.GetProperty("locked_panel_size").GetInt32();
        Assert.InRange(locked, 1, listed);
        // The locked panel holds the first markers of the shortlist, in its order.
        var shortlist = File.ReadAllLines(Path.Combine(results, "shortlist.tsv")).Skip(1).Select(l => l.Split('\t')[1]).Take(locked).ToArray();
        using var panel = JsonDocument.Parse(File.ReadAllText(Path.Combine(results, "locked_panel.json")));
        var text = panel.RootElement.ToString();
        foreach (string marker in shortlist) Assert.Contains(marker, text);
    }
}
