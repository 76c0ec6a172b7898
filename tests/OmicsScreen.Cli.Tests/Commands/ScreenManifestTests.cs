using System.Text;
using System.Text.RegularExpressions;
using OmicsScreen.Cli.Tests.Workflow;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// The screen's manifest, now a typed record (Reporting/Manifests/ScreenManifest), is the same
/// bytes as the anonymous object it replaced wrote: Approved/screen.manifest.json was written by
/// the build before the change (commit 607b541) with this test's command, then masked as
/// <see cref="Masked"/> masks (timestamps, version, paths, core count and stage seconds differ by
/// run and machine; every key and its order, and every other value, must not). One key was added
/// deliberately since: panel.outcome_kind ("classes"), when screens of other outcome kinds came.
/// </summary>
public sealed class ScreenManifestTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void The_typed_manifest_writes_the_bytes_of_the_manifest_before_it()
    {
        string sheet = ScreenFixtures.WdbcCohortSheet(_folder);
        string output = Path.Combine(_folder.Path, "out");
        var run = CliHarness.Run("screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--samples", sheet, "--cohort", "group",
            "--out", output, "--pairs", "3", "--trees", "60", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "5",
            "--threads", "2", "--quiet");
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        string approved = File.ReadAllText(Path.Combine(RepositoryFolder.Root, "tests", "OmicsScreen.Cli.Tests", "Commands", "Approved", "screen.manifest.json"));
        Assert.Equal(approved, Masked(File.ReadAllText(Path.Combine(output, "manifest.json"))));
    }

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
            line = Regex.Replace(line, "^(  \"cores\": )\\d+(,?)$", "${1}0$2");
            text.Append(line);
            if (i < lines.Length - 1) text.Append('\n');
        }
        return text.ToString();
    }
}
