using System.Text.Json.Nodes;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// `screen --json` and `apply --json` print the headline results as JSON on standard output for
/// pipelines; `apply` warns when the cohort is the discovery file or shares samples with it.
/// Runs one small screen of the first 300 rows of the breast cancer data (reference/wdbc, UCI).
/// </summary>
public sealed class JsonOutputTests : IClassFixture<JsonOutputTests.Discovery>
{
    private readonly Discovery _discovery;

    public JsonOutputTests(Discovery discovery) => _discovery = discovery;

    /// <summary>The screen both kinds of test read: its results folder and the JSON it printed.</summary>
    public sealed class Discovery : IDisposable
    {
        public Discovery()
        {
            var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv"));
            DiscoveryFile = Folder.File("discovery.csv", string.Join('\n', lines.Take(301)) + "\n");
            NewFile = Folder.File("new.csv", string.Join('\n', lines.Take(1).Concat(lines.Skip(301))) + "\n");
            OverlappingFile = Folder.File("overlap.csv", string.Join('\n', lines.Take(1).Concat(lines.Skip(281))) + "\n");
            Results = Path.Combine(Folder.Path, "screen");
            Run = CliHarness.Run("screen", DiscoveryFile, "--outcome", "diagnosis", "--out", Results, "--pairs", "3", "--trees", "60",
                "--curve-folds", "3", "--curve-inner-pairs", "1", "--max-panel-size", "5", "--seed", "3", "--quiet", "--json");
        }

        internal TempFolder Folder { get; } = new();
        public string DiscoveryFile { get; }
        public string NewFile { get; }
        public string OverlappingFile { get; }
        public string Results { get; }
        internal CliHarness.Outcome Run { get; }

        public void Dispose() => Folder.Dispose();
    }

    [Fact]
    public void Screen_json_is_the_whole_standard_output_and_names_the_shortlist_and_files()
    {
        var run = _discovery.Run;
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        var json = JsonNode.Parse(run.Out)!.AsObject();
        Assert.Equal(300, json["samples"]!.GetValue<int>());
        Assert.Equal(30, json["features"]!.GetValue<int>());
        Assert.Equal(0, json["min_frequency"]!.GetValue<double>()); // the default: no frequency filter, q-values alone
        var shortlist = json["shortlist"]!.AsArray();
        Assert.NotEmpty(shortlist);
        Assert.Equal(1, shortlist[0]!["rank"]!.GetValue<int>());
        Assert.False(string.IsNullOrEmpty(shortlist[0]!["feature"]!.GetValue<string>()));
        Assert.True(File.Exists(json["report"]!.GetValue<string>()));
        Assert.True(File.Exists(json["locked_panel_file"]!.GetValue<string>()));
        int locked = json["locked_panel_size"]!.GetValue<int>();
        Assert.Equal(locked, json["locked_panel"]!.AsArray().Count);
        Assert.DoesNotContain("Shortlist:", run.Out);
    }

    [Fact]
    public void Apply_json_gives_the_calls_and_performance_without_warnings_on_new_samples()
    {
        var run = Apply(_discovery.NewFile, "new");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        var json = JsonNode.Parse(run.Out)!.AsObject();
        Assert.Equal(269, json["samples"]!.GetValue<int>());
        Assert.InRange(json["auc"]!.GetValue<double>(), 0.8, 1.0);
        Assert.Equal(269, json["called"]!.AsObject().Sum(p => p.Value!.GetValue<int>()));
        Assert.DoesNotContain(json["warnings"]!.AsArray(), w => w!.GetValue<string>().Contains("discovery", StringComparison.Ordinal));
        Assert.DoesNotContain("discovery", run.Error);
    }

    [Fact]
    public void Apply_warns_when_the_cohort_is_the_discovery_file_itself()
    {
        var run = Apply(_discovery.DiscoveryFile, "same");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Contains("warning: discovery.csv is the discovery file 'discovery.csv' itself (same SHA-256)", run.Error);
        var json = JsonNode.Parse(run.Out)!.AsObject();
        Assert.Contains(json["warnings"]!.AsArray(), w => w!.GetValue<string>().Contains("measures fit, not validation", StringComparison.Ordinal));
        string report = File.ReadAllText(Path.Combine(_discovery.Folder.Path, "same", "apply_report.html"));
        Assert.Contains("is the discovery file", report);
    }

    [Fact]
    public void Apply_warns_when_the_cohort_shares_sample_ids_with_the_discovery_data()
    {
        var run = Apply(_discovery.OverlappingFile, "overlap");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Contains("warning: 20 of 289 samples have the ids of discovery samples", run.Error);
    }

    private CliHarness.Outcome Apply(string cohort, string folderName) =>
        CliHarness.Run("apply", Path.Combine(_discovery.Results, "locked_panel.json"), cohort, "--outcome", "diagnosis",
            "--out", Path.Combine(_discovery.Folder.Path, folderName), "--json");
}
