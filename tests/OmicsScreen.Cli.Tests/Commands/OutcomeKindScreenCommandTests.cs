using System.Text;
using System.Text.Json;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// `screen` on a measured and a time-to-event outcome, end to end through the CLI: the tables name
/// the measures of the kind, the planted markers come first, the report speaks of R² or
/// concordance, and the locked panel is written for `apply` (ApplyOutcomeKindCommandTests applies it).
/// The panels are invented (planted markers SIM000 and SIM001; the answer is known by construction).
/// </summary>
public sealed class OutcomeKindScreenCommandTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>120 samples x 30 features (value 5 + z); outcome = z0 + 0.8 z1 + noise, or exponential times with log hazard 0.9 z0 + 0.8 z1.</summary>
    private (string Matrix, string Sheet) Files(bool followUp)
    {
        const int samples = 120, features = 30;
        var generator = SeedSchedule.Generator(77, 0, 0, SeedPurpose.Sampling);
        var z = new double[features, samples];
        var matrix = new StringBuilder("sample_id");
        for (int f = 0; f < features; f++) matrix.Append(FormattableString.Invariant($",SIM{f:D3}"));
        matrix.Append('\n');
        var sheet = new StringBuilder("sample_id,score,months,relapse\n");
        for (int s = 0; s < samples; s++)
        {
            matrix.Append(FormattableString.Invariant($"P{s:D3}"));
            for (int f = 0; f < features; f++)
            {
                z[f, s] = generator.NextGaussian();
                matrix.Append(FormattableString.Invariant($",{5 + z[f, s]:0.0000}"));
            }
            matrix.Append('\n');
            double score = z[0, s] + 0.8 * z[1, s] + 0.7 * generator.NextGaussian();
            double eventTime = -Math.Log(1 - generator.NextDouble()) / Math.Exp(0.9 * z[0, s] + 0.8 * z[1, s]);
            double censorTime = -Math.Log(1 - generator.NextDouble()) / 0.4;
            sheet.Append(FormattableString.Invariant($"P{s:D3},{score:0.0000},{Math.Min(eventTime, censorTime):0.0000},{(eventTime <= censorTime ? 1 : 0)}\n"));
        }
        _ = followUp;
        return (_folder.File("panel.csv", matrix.ToString()), _folder.File("samples.csv", sheet.ToString()));
    }

    [Theory]
    [InlineData("measured")]
    [InlineData("time")]
    public void Screen_writes_a_results_folder_in_the_outcome_kinds_measures(string kind)
    {
        bool followUp = kind == "time";
        var (matrix, sheet) = Files(followUp);
        string output = Path.Combine(_folder.Path, "out");
        string[] outcome = followUp ? ["--follow-up", "months", "--event", "relapse"] : ["--outcome", "score"];

        var run = CliHarness.Run(["screen", matrix, "--samples", sheet, .. outcome, "--pairs", "5", "--trees", "100", "--curve-folds", "3",
            "--curve-inner-pairs", "2", "--out", output, "--quiet", "--json"]);

        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        using var headline = JsonDocument.Parse(run.Out);
        Assert.Equal(followUp ? "time_to_event" : "measured", headline.RootElement.GetProperty("outcome_kind").GetString());
        Assert.True(File.Exists(headline.RootElement.GetProperty("locked_panel_file").GetString()));
        Assert.True(headline.RootElement.TryGetProperty(followUp ? "out_of_bag_concordance" : "out_of_bag_r_squared", out _));
        var first = headline.RootElement.GetProperty("shortlist")[0];
        Assert.Equal(JsonValueKind.Null, first.GetProperty("auc").ValueKind);
        Assert.True(first.TryGetProperty(followUp ? "concordance" : "spearman_rho", out _));

        // The two planted markers lead the shortlist, in either order.
        var shortlist = File.ReadAllLines(Path.Combine(output, "shortlist.tsv"));
        var header = shortlist[0].Split('\t');
        Assert.Contains(followUp ? "log_rank_statistic" : "variance_decrease", header);
        Assert.Contains(followUp ? "hazard_ratio_per_sd" : "spearman_rho", header);
        Assert.DoesNotContain("auc", header);
        var top = shortlist.Skip(1).Take(2).Select(line => line.Split('\t')[Array.IndexOf(header, "feature")]).Order().ToArray();
        Assert.Equal(new[] { "SIM000", "SIM001" }, top);
        string direction = shortlist[1].Split('\t')[Array.IndexOf(header, "direction")];
        Assert.Equal(followUp ? "higher values, shorter survival" : "rises with the outcome", direction);

        var statistics = File.ReadAllLines(Path.Combine(output, "marker_statistics.tsv"));
        Assert.Equal(31, statistics.Length);
        Assert.Contains(followUp ? "cox_model_converged" : "spearman_rho", statistics[0].Split('\t'));
        Assert.Contains(followUp ? "selection_aware_concordance" : "selection_aware_r_squared",
            File.ReadAllLines(Path.Combine(output, "panel_size_curve.tsv"))[0].Split('\t'));
        Assert.Contains(followUp ? "\"outcome_kind\": \"time_to_event\"" : "\"outcome_kind\": \"measured\"",
            File.ReadAllText(Path.Combine(output, "locked_panel.json")));

        string report = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains(followUp ? "concordance (Harrell&#39;s C)" : "R²", report);
        Assert.DoesNotContain("writes no panel file", report);
        Assert.Contains("The panel locked for", report);
        Assert.Contains(followUp ? "Survival by the top markers" : "The top markers against the outcome", report);
        Assert.Contains(followUp ? "Discovery risk groups, log-rank p" : "Observed against out-of-bag predicted", report);
        Assert.Contains("not a diagnostic test", report);
        Assert.DoesNotContain("P001", report);

        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "manifest.json")));
        var panel = manifest.RootElement.GetProperty("panel");
        Assert.Equal(followUp ? "time_to_event" : "measured", panel.GetProperty("outcome_kind").GetString());
        Assert.False(panel.TryGetProperty("classes", out _));
        Assert.Equal(5, manifest.RootElement.GetProperty("parameters").GetProperty("min_leaf").GetInt32());

        // A measured outcome's curve gives the held-out RMSE beside R², in the table, the manifest and the report.
        var curveHeader = File.ReadAllLines(Path.Combine(output, "panel_size_curve.tsv"))[0].Split('\t');
        var results = manifest.RootElement.GetProperty("results");
        Assert.Equal(!followUp, curveHeader.Contains("selection_aware_rmse"));
        Assert.Equal(!followUp, curveHeader.Contains("optimistic_rmse"));
        Assert.Equal(!followUp, results.TryGetProperty("recommended_panel_size_selection_aware_rmse", out _));
        Assert.Equal(!followUp, report.Contains("Selection-aware RMSE", StringComparison.Ordinal));
    }

    [Fact]
    public void Outcome_permutations_are_refused_for_a_measured_outcome()
    {
        var (matrix, sheet) = Files(followUp: false);
        var run = CliHarness.Run("screen", matrix, "--samples", sheet, "--outcome", "score", "--outcome-permutations", "100",
            "--out", Path.Combine(_folder.Path, "p"), "--quiet");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("--outcome-permutations", run.Error);
        Assert.Contains("class outcomes only", run.Error);
    }
}
