using System.Text;
using System.Text.RegularExpressions;
using OmicsScreen.Cli.Tests.Workflow;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// The manifests of screen and apply and apply's evaluation.json, now typed records
/// (Reporting/Manifests), are the same bytes as the anonymous objects they replaced wrote:
/// Approved/screen.manifest.json, apply.manifest.json and apply.evaluation.json were written by
/// the build before the change (commit 607b541) with these tests' commands, the manifests then
/// masked as <see cref="Masked"/> masks (timestamps, version, paths, the locked panel's SHA-256
/// (it holds the version), core count and stage seconds differ by run and machine; every key and
/// its order, and every other value, must not). One key was added deliberately since:
/// panel.outcome_kind ("classes") of the screen manifest, when screens of other outcome kinds came;
/// and with effect shapes and forest partners (issue 19) results.effects, seconds.effects and the
/// output effect_shapes.tsv.
/// </summary>
public sealed class ScreenManifestTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void The_typed_manifest_writes_the_bytes_of_the_manifest_before_it()
    {
        string output = Screen();
        Assert.Equal(Approved("screen.manifest.json"), Masked(File.ReadAllText(Path.Combine(output, "manifest.json"))));
    }

    [Fact]
    public void The_typed_apply_manifest_writes_the_bytes_of_the_manifest_before_it()
    {
        string screened = Screen();
        string output = Path.Combine(_folder.Path, "applied");
        var run = CliHarness.Run("apply", Path.Combine(screened, "locked_panel.json"), ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis",
            "--out", output);
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Equal(Approved("apply.manifest.json"), Masked(File.ReadAllText(Path.Combine(output, "manifest.json"))));
        // evaluation.json, also a typed record now, holds nothing that differs by run: compared unmasked.
        Assert.Equal(Approved("apply.evaluation.json"), File.ReadAllText(Path.Combine(output, "evaluation.json")));
    }

    private string Screen()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        string output = Path.Combine(_folder.Path, "out");
        var run = CliHarness.Run("screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--samples", sheet, "--cohort", "group",
            "--out", output, "--pairs", "3", "--trees", "60", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "5",
            "--threads", "2", "--quiet");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        return output;
    }

    private static string Approved(string fileName) =>
        File.ReadAllText(Path.Combine(RepositoryFolder.Root, "tests", "OmicsScreen.Cli.Tests", "Commands", "Approved", fileName));

    /// <summary>The values that differ by run and machine, replaced line by line; everything else is kept byte for byte.</summary>
    private static string Masked(string manifest)
    {
        var text = new StringBuilder();
        bool inSeconds = false;
        var lines = manifest.Split('\n');
        for (int i = 0; i < lines.Length; i++)
        {
            string line = lines[i];
            if (inSeconds)
            {
                if (line.StartsWith("  }", StringComparison.Ordinal)) inSeconds = false;
                else line = Regex.Replace(line, "^(    \"[a-z_]+\": )[^,]+(,?)$", "${1}0$2");
            }
            if (line == "  \"seconds\": {") inSeconds = true;
            line = Regex.Replace(line, "^(  \"(?:command_line|finished_utc|started_utc|version)\": )\".*\"(,?)$", "$1\"-\"$2");
            line = Regex.Replace(line, "^(      \"path\": )\".*\"(,?)$", "$1\"-\"$2");
            line = Regex.Replace(line, "^(    \"(?:path|sha256)\": )\".*\"(,?)$", "$1\"-\"$2");
            line = Regex.Replace(line, "^(  \"cores\": )\\d+(,?)$", "${1}0$2");
            text.Append(line);
            if (i < lines.Length - 1) text.Append('\n');
        }
        return text.ToString();
    }
}
