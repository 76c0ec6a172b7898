using System.Globalization;
using System.Text;
using System.Text.Json.Nodes;
using OmicsScreen.Cli;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// `screen --covariates` end to end on an invented panel whose first marker only tracks age:
/// added_value.tsv, covariate_association.tsv, the shortlist's tracks column, the manifest and
/// --json entries, and the report's headline.
/// </summary>
public class CovariateScreenCommandTests
{
    [Fact]
    public void A_screen_with_covariates_writes_the_added_value_and_the_tracking_everywhere()
    {
        using var folder = new TempFolder();
        // Invented design (known by construction): status depends on age (logit 2.5 a) and on INV02
        // (logit 2.0 z); INV01 = 0.7 a + 0.7 e only tracks age; INV03..INV12 are noise.
        var random = new OmicsScreen.Engine.Randomness.Xoshiro256StarStar(20261205);
        int samples = 200, features = 12;
        var matrix = new StringBuilder("sample_id," + string.Join(",", Enumerable.Range(1, features).Select(f => $"INV{f:D2}")) + "\n");
        var sheet = new StringBuilder("sample_id\tstatus\tage\tsex\n");
        for (int s = 0; s < samples; s++)
        {
            double a = random.NextGaussian(), z = random.NextGaussian();
            var values = new double[features];
            values[0] = 0.7 * a + 0.7 * random.NextGaussian();
            values[1] = z;
            for (int f = 2; f < features; f++) values[f] = random.NextGaussian();
            bool isCase = random.NextDouble() < 1 / (1 + Math.Exp(-(2.5 * a + 2.0 * z)));
            matrix.Append(CultureInfo.InvariantCulture, $"inv-{s:D3},{string.Join(",", values.Select(v => (5 + v).ToString("0.0000", CultureInfo.InvariantCulture)))}\n");
            sheet.Append(CultureInfo.InvariantCulture, $"inv-{s:D3}\t{(isCase ? "case" : "control")}\t{60 + 10 * a:0.0}\t{(random.NextDouble() < 0.5 ? "F" : "M")}\n");
        }
        string output = Path.Combine(folder.Path, "out");
        var run = CliHarness.Run("screen", folder.File("m.csv", matrix.ToString()), "--samples", folder.File("s.tsv", sheet.ToString()),
            "--outcome", "status", "--covariates", "age,sex", "--pairs", "4", "--trees", "120", "--curve-folds", "3", "--curve-inner-pairs", "2",
            "--max-panel-size", "5", "--seed", "5", "--out", output, "--json", "--quiet");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);

        var added = File.ReadAllLines(Path.Combine(output, "added_value.tsv"));
        Assert.Equal(4, added.Length);
        Assert.StartsWith("covariates+panel\tage,sex\t", added[3]);
        var association = File.ReadAllLines(Path.Combine(output, "covariate_association.tsv"));
        Assert.StartsWith("feature\tcovariate\ttest\teffect", association[0]);
        var shortlist = File.ReadAllLines(Path.Combine(output, "shortlist.tsv"));
        int tracksColumn = Array.IndexOf(shortlist[0].Split('\t'), "tracks");
        Assert.True(tracksColumn > 0);
        // Known truth: INV01 only tracks age (by construction), INV02 carries its own signal.
        var rows = shortlist.Skip(1).Select(l => l.Split('\t')).ToDictionary(c => c[1], c => c[tracksColumn]);
        Assert.Equal("age", rows["INV01"]);
        Assert.Equal("", rows["INV02"]);

        var json = JsonNode.Parse(run.Out)!;
        Assert.Equal("auc", json["added_value"]!["metric"]!.GetValue<string>());
        Assert.Equal("age", json["shortlist"]!.AsArray().First(m => m!["feature"]!.GetValue<string>() == "INV01")!["tracks"]![0]!.GetValue<string>());
        var manifest = JsonNode.Parse(File.ReadAllText(Path.Combine(output, "manifest.json")))!;
        Assert.Equal("delong", manifest["results"]!["added_value"]!["interval_method"]!.GetValue<string>());
        Assert.Equal("age", manifest["results"]!["tracking_markers"]!["INV01"]![0]!.GetValue<string>());
        Assert.Equal("sex", manifest["panel"]!["covariates"]![1]!.GetValue<string>());
        string report = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains("over age and sex", report);
        Assert.Contains("INV01 tracks age", report);
    }
}
