using System.Globalization;
using System.Text;
using System.Text.Json;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// The cohort check of a measured and of a time-to-event screen, end to end through the CLI, on
/// invented panels with a planted answer: SIM000 acts on the outcome in every cohort alike;
/// SIM001 is shifted by 2.5 SD in cohort "south" only and has no effect within any cohort, while
/// the outcome itself is higher (or the hazard larger) in "south". SIM001 therefore tracks the
/// outcome over all samples only through the cohort: the check must flag it as a cohort artefact
/// and must not flag SIM000 so. Cohort names and sample ids are invented.
/// </summary>
public sealed class OutcomeKindCohortCommandTests : IDisposable
{
    private static readonly string[] Cohorts = ["north", "east", "south"];
    private const int PerCohort = 80, FeatureCount = 24;

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private (string Matrix, string Sheet) Files()
    {
        var generator = SeedSchedule.Generator(1717, 0, 0, SeedPurpose.Sampling);
        var matrix = new StringBuilder("sample_id");
        for (int f = 0; f < FeatureCount; f++) matrix.Append(CultureInfo.InvariantCulture, $",SIM{f:D3}");
        matrix.Append('\n');
        var sheet = new StringBuilder("sample_id,centre,score,months,relapse\n");
        for (int c = 0; c < Cohorts.Length; c++)
            for (int i = 0; i < PerCohort; i++)
            {
                string id = string.Create(CultureInfo.InvariantCulture, $"Q{c}{i:D3}");
                bool south = c == 2;
                var z = new double[FeatureCount];
                for (int f = 0; f < FeatureCount; f++) z[f] = generator.NextGaussian();
                matrix.Append(id);
                for (int f = 0; f < FeatureCount; f++)
                    matrix.Append(CultureInfo.InvariantCulture, $",{5 + z[f] + (f == 1 && south ? 2.5 : 0):0.0000}");
                matrix.Append('\n');
                double score = z[0] + (south ? 1.0 : 0) + 0.6 * generator.NextGaussian();
                double eventTime = -Math.Log(1 - generator.NextDouble()) / Math.Exp(0.9 * z[0] + (south ? 0.8 : 0));
                double censorTime = -Math.Log(1 - generator.NextDouble()) / 0.3;
                sheet.Append(CultureInfo.InvariantCulture,
                    $"{id},{Cohorts[c]},{score:0.0000},{Math.Min(eventTime, censorTime):0.0000},{(eventTime <= censorTime ? 1 : 0)}\n");
            }
        return (_folder.File("panel.csv", matrix.ToString()), _folder.File("samples.csv", sheet.ToString()));
    }

    private static string[] Outcome(string kind) => kind == "time" ? ["--follow-up", "months", "--event", "relapse"] : ["--outcome", "score"];

    private static string[] ScreenArgs(string matrix, string sheet, string kind, string output, params string[] extra) =>
    [
        "screen", matrix, "--samples", sheet, .. Outcome(kind), "--cohort", "centre", "--pairs", "3", "--trees", "80",
        "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "5", "--out", output, "--quiet", .. extra,
    ];

    private static Dictionary<string, string> Row(string[] header, string line) =>
        header.Zip(line.Split('\t')).ToDictionary(p => p.First, p => p.Second);

    [Theory]
    [InlineData("measured")]
    [InlineData("time")]
    public void A_marker_shifted_in_one_cohort_is_flagged_as_an_artefact_and_a_consistent_marker_is_not(string kind)
    {
        var (matrix, sheet) = Files();
        string output = Path.Combine(_folder.Path, "out-" + kind);
        var run = CliHarness.Run(ScreenArgs(matrix, sheet, kind, output, "--json"));
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.DoesNotContain("covers class outcomes", run.Error);
        using var headline = JsonDocument.Parse(run.Out);
        Assert.Equal(kind == "time" ? "time_to_event" : "measured", headline.RootElement.GetProperty("outcome_kind").GetString());

        string effect = kind == "time" ? "hazard_ratio_per_sd" : "rho";
        var markers = File.ReadAllLines(Path.Combine(output, "cohort_markers.tsv"));
        var header = markers[0].Split('\t');
        Assert.Contains("pooled_" + effect, header);
        Assert.Contains("within_cohort_" + effect + "_low95", header);
        Assert.DoesNotContain("pooled_auc", header);
        Assert.Equal(FeatureCount + 1, markers.Length);
        var byFeature = markers.Skip(1).Select(line => Row(header, line)).ToDictionary(r => r["feature"]);

        // The planted artefact: an effect over all samples, none within cohorts, "south" set apart.
        Assert.Equal("cohort_artefact", byFeature["SIM001"]["cohort_flag"]);
        Assert.Equal("south", byFeature["SIM001"]["most_separated_cohort"]);
        // The consistent marker: an effect within every cohort, never explained by cohort.
        Assert.NotEqual("cohort_artefact", byFeature["SIM000"]["cohort_flag"]);
        double within = double.Parse(byFeature["SIM000"]["within_cohort_" + effect], CultureInfo.InvariantCulture);
        double none = kind == "time" ? 1 : 0;
        Assert.True(within > none + 0.3, $"SIM000 within-cohort {effect} {within}");

        // Every cohort has its effect row, in the kind's measure; no class columns.
        var effects = File.ReadAllLines(Path.Combine(output, "cohort_effects.tsv"));
        Assert.Equal(["feature", "cohort", "samples", effect, effect + "_low95", effect + "_high95"], effects[0].Split('\t'));
        Assert.Equal(FeatureCount * Cohorts.Length + 1, effects.Length);

        // Leave one cohort out: every cohort held out, scored in R² or C.
        var validation = File.ReadAllLines(Path.Combine(output, "cohort_validation.tsv"));
        var validationHeader = validation[0].Split('\t');
        Assert.Contains(kind == "time" ? "concordance" : "r_squared", validationHeader);
        Assert.Equal(Cohorts.Length + 1, validation.Length);
        Assert.Equal(Cohorts.Length + 1, File.ReadAllLines(Path.Combine(output, "cohort_concordance.tsv")).Length);

        string report = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains("A cohort never seen", report);
        Assert.Contains("eta", report);
        Assert.DoesNotContain("covers class outcomes", report);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "manifest.json")));
        var outputs = manifest.RootElement.GetProperty("outputs").EnumerateArray().Select(e => e.GetString()).ToList();
        Assert.Contains("cohort_markers.tsv", outputs);
        Assert.Contains("cohort_validation.tsv", outputs);
        Assert.Equal("centre", manifest.RootElement.GetProperty("panel").GetProperty("cohort_column").GetString());
    }

    [Theory]
    [InlineData("measured")]
    [InlineData("time")]
    public void One_and_two_threads_and_three_merged_parts_write_the_same_cohort_tables(string kind)
    {
        var (matrix, sheet) = Files();
        string one = Path.Combine(_folder.Path, "one"), two = Path.Combine(_folder.Path, "two");
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenArgs(matrix, sheet, kind, one, "--threads", "1")).ExitCode);
        Assert.Equal(ExitCode.Success, CliHarness.Run(ScreenArgs(matrix, sheet, kind, two, "--threads", "2")).ExitCode);
        var parts = new List<string>();
        for (int i = 1; i <= 3; i++)
        {
            string part = Path.Combine(_folder.Path, "part" + i);
            var run = CliHarness.Run(ScreenArgs(matrix, sheet, kind, part, "--part", $"{i}/3", "--threads", "2"));
            Assert.True(run.ExitCode == ExitCode.Success, run.Error);
            parts.Add(part);
        }
        // 6 repeats (3 pairs) + 3 curve folds + 3 cohort screens + 3 held-out screens: the cohort units are in the plan.
        Assert.Equal(15, parts.Sum(p => Directory.GetFiles(p, "*.unit").Length));
        string merged = Path.Combine(_folder.Path, "merged");
        var merge = CliHarness.Run("merge", parts[2], parts[0], parts[1], "--out", merged, "--quiet");
        Assert.True(merge.ExitCode == ExitCode.Success, merge.Error);
        foreach (var table in new[] { "shortlist.tsv", "features.tsv", "panel_size_curve.tsv", "marker_statistics.tsv", "cohort_markers.tsv",
                     "cohort_effects.tsv", "cohort_concordance.tsv", "cohort_validation.tsv" })
        {
            var first = File.ReadAllBytes(Path.Combine(one, table));
            Assert.True(first.AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(two, table))), $"{table}: 1 and 2 threads differ");
            Assert.True(first.AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(merged, table))), $"{table}: merged parts differ from one run");
        }
        // The report's figures drawn from the forest on all samples are the same too (a merge grows it again).
        string figure = kind == "time" ? "Discovery risk groups" : "Observed against out-of-bag predicted score";
        string single = Svg(File.ReadAllText(Path.Combine(one, "report.html")), figure);
        Assert.Equal(single, Svg(File.ReadAllText(Path.Combine(two, "report.html")), figure));
        Assert.Equal(single, Svg(File.ReadAllText(Path.Combine(merged, "report.html")), figure));
    }

    /// <summary>The inline SVG whose title starts with <paramref name="title"/>.</summary>
    private static string Svg(string html, string title)
    {
        int at = html.IndexOf("<title>" + title, StringComparison.Ordinal);
        Assert.True(at >= 0, $"no figure titled '{title}' in the report");
        int start = html.LastIndexOf("<svg", at, StringComparison.Ordinal);
        int end = html.IndexOf("</svg>", at, StringComparison.Ordinal);
        return html[start..end];
    }
}
