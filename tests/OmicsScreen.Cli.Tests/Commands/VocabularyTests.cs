using System.CommandLine;
using System.Text.Json.Nodes;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// Issue 14: one name per concept. A setting of the screen has one name shared by its option,
/// its manifest key and its report label (ScreenParameters, listed in DEVELOPERS.md); counts and
/// importances have the same keys in every JSON and table.
/// </summary>
public sealed class VocabularyTests
{
    /// <summary>Options of `screen` that say where data is or how the run behaves, not what it computes.</summary>
    private static readonly HashSet<string> NotSettings =
    [
        "--samples", "--outcome", "--outcome-kind", "--follow-up", "--event", "--cohort", "--covariates", "--subject", "--positive-class", "--id-column", "--annotation", "--features-in-rows",
        "--drop-unmatched", "--feature-block", "--keep-features", "--out", "--force", "--resume", "--part", "--show-sample-ids",
        "--quiet", "--memory-limit", "--json",
        "--feature-sheet", "--detection-limit", "--long", "--feature-columns", "--value-column", "--below-detection-flag", "--quality-flag", "--display-name",
    ];

    [Fact]
    public void Every_setting_of_screen_has_one_name_for_option_manifest_key_and_report_label()
    {
        var screen = new ScreenCommand(new CliConsole(TextWriter.Null, TextWriter.Null, isTerminal: false));
        var settings = screen.Options.Where(o => !o.Hidden && !NotSettings.Contains(o.Name)).Select(o => o.Name).Order().ToList();
        Assert.Equal(settings, ScreenParameters.All.Select(p => p.Option).Order().ToList());
        foreach (var parameter in ScreenParameters.All)
            Assert.Equal(parameter.Option[2..].Replace('-', '_'), parameter.Key);
        string developers = File.ReadAllText(Path.Combine(Workflow.RepositoryFolder.Root, "DEVELOPERS.md"));
        foreach (var parameter in ScreenParameters.All)
            Assert.Contains($"| `{parameter.Option}` | `{parameter.Key}` | {parameter.Label} |", developers);
    }

    [Fact]
    public void Check_json_names_counts_as_the_manifest_does()
    {
        var run = CliHarness.Run("check", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--json");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        var json = JsonNode.Parse(run.Out)!;
        Assert.Equal(569, json["inspection"]!["samples"]!.GetValue<int>());
        Assert.True(json["inputs"]![0]!["bytes"]!.GetValue<long>() > 0);
        Assert.DoesNotContain("_count\"", run.Out);
    }

    [Fact]
    public void Grow_json_and_its_table_name_the_impurity_decrease_alike()
    {
        using var folder = new TempFolder();
        string table = Path.Combine(folder.Path, "importance.tsv");
        var run = CliHarness.Run("grow", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--trees", "20", "--json",
            "--importance-out", table, "--balance", "on");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Contains("mean_gini_decrease", File.ReadLines(table).First());
        var json = JsonNode.Parse(run.Out)!;
        Assert.NotNull(json["impurity_decrease"]![0]!["mean_gini_decrease"]);
        Assert.Equal("on", json["forest"]!["balance"]!.GetValue<string>());
        Assert.True(json["forest"]!["class_balanced"]!.GetValue<bool>());
    }

    [Fact]
    public void Grow_still_takes_the_old_balanced_switch_without_showing_it()
    {
        var run = CliHarness.Run("grow", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--trees", "20", "--json", "--balanced");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.True(JsonNode.Parse(run.Out)!["forest"]!["class_balanced"]!.GetValue<bool>());
        Assert.DoesNotContain("--balanced", CliHarness.Run("grow", "--help").Out);
    }
}
