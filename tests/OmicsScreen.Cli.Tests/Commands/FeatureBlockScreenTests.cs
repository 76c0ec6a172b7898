using System.Text.Json;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// The path for panels too wide for one machine's memory: each block of features screened on its
/// own (reading only its columns), the best candidates of every block screened together.
/// </summary>
public sealed class FeatureBlockScreenTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Screening_four_feature_blocks_then_their_candidates_recovers_the_planted_markers_of_the_demo()
    {
        string panelDir = Path.Combine(_folder.Path, "panel");
        Assert.Equal(ExitCode.Success, CliHarness.Run("demo", "--panel-dir", panelDir, "--panel-only", "--quiet").ExitCode);
        string matrix = Path.Combine(panelDir, "marrowfen_plasma.csv");
        string sheet = Path.Combine(panelDir, "marrowfen_samples.tsv");
        // The demo's own truth table (invented study): 17 planted markers among 2,000 analytes.
        var planted = File.ReadLines(Path.Combine(panelDir, "marrowfen_truth.tsv")).Skip(1).Select(l => l.Split('\t'))
            .Where(c => c[1].Contains("marker", StringComparison.Ordinal)).Select(c => c[0]).ToHashSet();
        Assert.Equal(17, planted.Count);

        var candidates = new List<string>();
        for (int block = 1; block <= 4; block++)
        {
            string output = Path.Combine(_folder.Path, "block" + block);
            var run = CliHarness.Run("screen", matrix, "--samples", sheet, "--outcome", "status", "--feature-block", $"{block}/4",
                "--pairs", "3", "--trees", "100", "--curve-folds", "0", "--quiet", "--out", output);
            Assert.True(run.ExitCode == ExitCode.Success, run.Error);
            using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "manifest.json")));
            Assert.Equal(500, manifest.RootElement.GetProperty("panel").GetProperty("features").GetInt32());
            Assert.Equal($"{block}/4", manifest.RootElement.GetProperty("panel").GetProperty("feature_block").GetString());
            // The 15 best of each block by the screen's own order (column 2 of features.tsv).
            candidates.AddRange(File.ReadLines(Path.Combine(output, "features.tsv")).Skip(1).Take(15).Select(l => l.Split('\t')[1]));
        }
        string list = _folder.File("candidates.txt", "# best 15 of each block\n" + string.Join("\n", candidates) + "\n");

        string final = Path.Combine(_folder.Path, "final");
        var second = CliHarness.Run("screen", matrix, "--samples", sheet, "--outcome", "status", "--keep-features", list,
            "--pairs", "5", "--trees", "200", "--curve-folds", "0", "--quiet", "--out", final);
        Assert.True(second.ExitCode == ExitCode.Success, second.Error);
        Assert.Contains("do not account for that choice", second.Error);
        var shortlist = File.ReadLines(Path.Combine(final, "shortlist.tsv")).Skip(1).Select(l => l.Split('\t')[1]).ToList();
        Assert.True(shortlist.Count(planted.Contains) >= 15, $"planted markers shortlisted: {shortlist.Count(planted.Contains)} of 17");
        // The second stage screens candidates that the first stage chose on the same samples, so its
        // q-values cannot account for that choice (the tool says so, above): noise that won the first
        // stage looks associated in the second. What the two stages promise is the order: the
        // planted markers lead it.
        var top = shortlist.Take(17).ToList();
        Assert.True(top.Count(planted.Contains) >= 15, "first 17 of the shortlist: " + string.Join(", ", top));
        Assert.Contains("features from a list", File.ReadAllText(Path.Combine(final, "report.html")));
    }

    [Fact]
    public void A_malformed_block_and_a_missing_feature_list_are_refused_with_the_fix()
    {
        string wdbc = OmicsScreen.TestSupport.ReferenceData.Wdbc("wdbc.csv");
        var block = CliHarness.Run("check", wdbc, "--outcome", "diagnosis", "--feature-block", "0/4");
        Assert.Equal(ExitCode.Usage, block.ExitCode);
        Assert.Contains("--feature-block takes I/N", block.Error);
        var list = CliHarness.Run("check", wdbc, "--outcome", "diagnosis", "--keep-features", Path.Combine(_folder.Path, "absent.txt"));
        Assert.Equal(ExitCode.InputError, list.ExitCode);
        Assert.Contains("does not exist", list.Error);
        var kept = CliHarness.Run("check", wdbc, "--outcome", "diagnosis", "--feature-block", "2/3");
        Assert.Equal(ExitCode.Success, kept.ExitCode);
        Assert.Matches(@"features\s+10\n", kept.Out);
    }
}
