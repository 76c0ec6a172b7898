using System.Globalization;
using System.Text;
using System.Text.Json.Nodes;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// Through the command line: a long table with a feature sheet is screened, and the display names
/// reach the console top list, the tables, the locked panel and `apply`, which matches markers by id.
/// </summary>
public sealed class FeatureNamesCommandTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>
    /// 40 samples, two classes; f1 is shifted by 4 units between the classes (a planted marker no
    /// screen can miss), f2..f5 are a fixed arithmetic noise pattern unrelated to the class.
    /// </summary>
    private string LongPanel()
    {
        var text = new StringBuilder("sample,feature,value,status\n");
        for (int s = 0; s < 40; s++)
        {
            string status = s % 2 == 0 ? "case" : "control";
            for (int f = 1; f <= 5; f++)
            {
                double value = f == 1 ? (s % 2 == 0 ? 6 : 2) + (s * 7 % 10) / 10.0 : (s * (f + 3) % 11) / 3.0;
                text.Append(CultureInfo.InvariantCulture, $"S{s:D2},f{f},{value},{status}\n");
            }
        }
        return _folder.File("long.csv", text.ToString());
    }

    [Fact]
    public void Display_names_reach_the_console_tables_locked_panel_and_apply_and_control_characters_are_stripped()
    {
        string matrix = LongPanel();
        // A bell character in a display name: the console must not pass it through (common practice).
        string sheet = _folder.File("features.csv", "feature,display_name,assay_panel\nf1,Lab IL\u00076,inflammation\nf2,Lab TNF,inflammation\nf3,,metabolic\nf4,Lab GLU,metabolic\nf5,Lab LAC,metabolic\n");
        string results = Path.Combine(_folder.Path, "results");

        var screen = CliHarness.Run("screen", matrix, "--long", "--outcome", "status", "--feature-sheet", sheet, "--out", results,
            "--pairs", "3", "--trees", "50", "--curve-folds", "2", "--curve-inner-pairs", "1", "--max-panel-size", "2", "--quiet");

        Assert.Equal(ExitCode.Success, screen.ExitCode);
        // The console's rule (UntrustedText.Printable): a control character is shown by its code.
        Assert.Contains("Lab IL\\u00076 (f1)", screen.Out);
        Assert.DoesNotContain("\u0007", screen.Out);
        var shortlist = File.ReadAllLines(Path.Combine(results, "shortlist.tsv"));
        var header = shortlist[0].Split('\t');
        Assert.Equal("display_name", header[Array.IndexOf(header, "feature") + 1]);
        Assert.Equal("assay_panel", header[^1]);
        var f1 = shortlist.Skip(1).Select(l => l.Split('\t')).Single(c => c[Array.IndexOf(header, "feature")] == "f1");
        Assert.Equal("inflammation", f1[^1]);
        Assert.Contains("marker_display_names", File.ReadAllText(Path.Combine(results, "locked_panel.json")));
        Assert.Contains("Marker (feature id)", File.ReadAllText(Path.Combine(results, "report.html")));

        // apply matches markers by id, on a wide file of new samples that has no feature sheet at all.
        var wide = new StringBuilder("sample_id,f5,f4,f3,f2,f1\n");
        for (int s = 0; s < 6; s++) wide.Append(CultureInfo.InvariantCulture, $"N{s},1,1,1,1,{(s < 3 ? 6.5 : 2.5)}\n");
        var apply = CliHarness.Run("apply", Path.Combine(results, "locked_panel.json"), _folder.File("new.csv", wide.ToString()),
            "--out", Path.Combine(_folder.Path, "applied"));

        Assert.Equal(ExitCode.Success, apply.ExitCode);
        Assert.Contains("Markers (matched by id):", apply.Out);
        Assert.Contains("(f1)", apply.Out);
    }

    [Fact]
    public void Screen_json_and_apply_json_carry_the_display_names_of_the_shortlist_and_the_locked_panel()
    {
        string matrix = LongPanel();
        // f3 has no display name: its entry must say so (null), not repeat the id.
        string sheet = _folder.File("features.csv", "feature,display_name\nf1,Lab IL6\nf2,Lab TNF\nf3,\nf4,Lab GLU\nf5,Lab LAC\n");
        string results = Path.Combine(_folder.Path, "results");

        var screen = CliHarness.Run("screen", matrix, "--long", "--outcome", "status", "--feature-sheet", sheet, "--out", results,
            "--pairs", "3", "--trees", "50", "--curve-folds", "2", "--curve-inner-pairs", "1", "--max-panel-size", "2", "--quiet", "--json");

        Assert.True(screen.ExitCode == ExitCode.Success, screen.Error);
        var json = JsonNode.Parse(screen.Out)!.AsObject();
        var expected = new Dictionary<string, string?> { ["f1"] = "Lab IL6", ["f2"] = "Lab TNF", ["f3"] = null, ["f4"] = "Lab GLU", ["f5"] = "Lab LAC" };
        var shortlist = json["shortlist"]!.AsArray();
        // f1 is shifted by 4 units between the classes (see LongPanel): it must be shortlisted.
        Assert.Contains(shortlist, m => m!["feature"]!.GetValue<string>() == "f1");
        foreach (var marker in shortlist)
            Assert.Equal(expected[marker!["feature"]!.GetValue<string>()], marker["display_name"]?.GetValue<string>());
        var locked = json["locked_panel"]!.AsArray().Select(m => m!.GetValue<string>()).ToList();
        Assert.NotEmpty(locked);
        var lockedNames = json["locked_panel_display_names"]!.AsObject();
        Assert.Equal(locked.Where(m => expected[m] is not null).Order(StringComparer.Ordinal), lockedNames.Select(p => p.Key).Order(StringComparer.Ordinal));
        foreach (var (id, name) in lockedNames) Assert.Equal(expected[id], name!.GetValue<string>());

        var wide = new StringBuilder("sample_id,f5,f4,f3,f2,f1\n");
        for (int s = 0; s < 6; s++) wide.Append(CultureInfo.InvariantCulture, $"N{s},1,1,1,1,{(s < 3 ? 6.5 : 2.5)}\n");
        var apply = CliHarness.Run("apply", json["locked_panel_file"]!.GetValue<string>(), _folder.File("new.csv", wide.ToString()),
            "--out", Path.Combine(_folder.Path, "applied"), "--json");

        Assert.True(apply.ExitCode == ExitCode.Success, apply.Error);
        var applied = JsonNode.Parse(apply.Out)!.AsObject();
        var applyNames = applied["marker_display_names"]!.AsObject();
        Assert.Equal(lockedNames.Select(p => (p.Key, p.Value!.GetValue<string>())), applyNames.Select(p => (p.Key, p.Value!.GetValue<string>())));
    }

    [Fact]
    public void Check_as_json_states_the_long_table_the_feature_sheet_and_the_cells_below_each_limit()
    {
        string matrix = LongPanel();
        string sheet = _folder.File("features.csv", "feature,detection_limit\nf1,3\nf2,\nf3,\nf4,\nf5,\n");

        var run = CliHarness.Run("check", matrix, "--long", "--outcome", "status", "--feature-sheet", sheet, "--json");

        Assert.Equal(ExitCode.Success, run.ExitCode);
        // f1 of the controls is 2 + (7s mod 10)/10 for odd s: 2.0 to 2.9, all under 3; the cases' 6 and up are not. 20 controls.
        Assert.Contains("\"censored_cells\": [", run.Out);
        Assert.Contains("\"cells\": 20", run.Out);
        Assert.Contains("\"long_table\": {", run.Out);
    }
}
