using System.Globalization;
using System.Text;
using OmicsScreen.Cli;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// The console summary of `screen`: a marker whose single-marker interval spans no effect is
/// described by the forest's shape words (as the report's shortlist table does), not by a bare
/// direction, and the markers that only track a covariate are named.
/// </summary>
public class ScreenSummaryEffectTests
{
    [Fact]
    public void The_summary_prints_shape_words_for_a_marker_without_a_marginal_effect_and_names_the_markers_that_track_a_covariate()
    {
        using var folder = new TempFolder();
        // Invented design (known by construction): logit P(case) = 2.5 a + 3.0 sign(z2 z3), so
        // INV02 and INV03 act only as a pair (each alone is symmetric about 0 and independent of
        // the other: no marginal shift); INV01 = 0.7 a + 0.7 e only tracks age; the rest is noise.
        var random = new OmicsScreen.Engine.Randomness.Xoshiro256StarStar(20261206);
        int samples = 240, features = 12;
        var matrix = new StringBuilder("sample_id," + string.Join(",", Enumerable.Range(1, features).Select(f => $"INV{f:D2}")) + "\n");
        var sheet = new StringBuilder("sample_id\tstatus\tage\n");
        for (int s = 0; s < samples; s++)
        {
            double a = random.NextGaussian();
            var values = new double[features];
            for (int f = 0; f < features; f++) values[f] = random.NextGaussian();
            values[0] = 0.7 * a + 0.7 * values[0];
            double logit = 2.5 * a + 3.0 * Math.Sign(values[1] * values[2]);
            bool isCase = random.NextDouble() < 1 / (1 + Math.Exp(-logit));
            matrix.Append(CultureInfo.InvariantCulture, $"inv-{s:D3},{string.Join(",", values.Select(v => (5 + v).ToString("0.0000", CultureInfo.InvariantCulture)))}\n");
            sheet.Append(CultureInfo.InvariantCulture, $"inv-{s:D3}\t{(isCase ? "case" : "control")}\t{60 + 10 * a:0.0}\n");
        }
        string output = Path.Combine(folder.Path, "out");
        var run = CliHarness.Run("screen", folder.File("m.csv", matrix.ToString()), "--samples", folder.File("s.tsv", sheet.ToString()),
            "--outcome", "status", "--covariates", "age", "--pairs", "4", "--trees", "150", "--curve-folds", "0",
            "--seed", "7", "--out", output);
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);

        var shortlist = File.ReadAllLines(Path.Combine(output, "shortlist.tsv"));
        var header = shortlist[0].Split('\t');
        var rows = shortlist.Skip(1).Select(l => l.Split('\t')).ToDictionary(c => c[Array.IndexOf(header, "feature")]);
        string Cell(string feature, string column) => rows[feature][Array.IndexOf(header, column)];
        double Number(string feature, string column) => double.Parse(Cell(feature, column), CultureInfo.InvariantCulture);
        var summaryRows = run.Out.Split('\n');

        // Known truth: at least one of the pair is shortlisted and its AUC interval spans 0.5
        // (no marginal shift by construction), so its console row carries the forest's shape words.
        var pair = new[] { "INV02", "INV03" }.Where(rows.ContainsKey).ToList();
        Assert.True(pair.Count > 0, run.Out);
        foreach (string marker in pair)
        {
            Assert.True(Number(marker, "auc_low95") <= 0.5 && 0.5 <= Number(marker, "auc_high95"), string.Join("\t", rows[marker]));
            string shape = Cell(marker, "effect_shape");
            Assert.False(string.IsNullOrEmpty(shape));
            var line = summaryRows.Single(l => l.Contains(" " + marker + " ", StringComparison.Ordinal));
            Assert.Contains("forest: " + shape, line);
            Assert.DoesNotContain(Cell(marker, "direction"), line);
        }
        // Known truth: INV01 only tracks age; the tables and the summary say the same.
        Assert.Equal("age", Cell("INV01", "tracks"));
        Assert.Contains("Only track a covariate: INV01 tracks age", run.Out);
    }
}
