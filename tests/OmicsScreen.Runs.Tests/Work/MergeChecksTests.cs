using OmicsScreen.Data;
using OmicsScreen.Runs.Work;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Tests.Work;

/// <summary>What a merge refuses before any work, and the single run it says the merge equals.</summary>
public sealed class MergeChecksTests
{
    private static RunRecord Part(int part, int parts, string identity = "run-a") => new()
    {
        Kind = "part",
        SoftwareVersion = "test",
        RunIdentity = identity,
        PanelSha256 = "panel",
        Inputs = [],
        LoadOptions = new PanelLoadOptions { MatrixPath = "panel.csv" },
        ScreenOptions = new ScreenOptions(),
        Part = part,
        Parts = parts,
        Complete = true,
    };

    [Fact]
    public void The_single_run_command_drops_only_the_part_resume_force_and_out_words()
    {
        var command = MergeChecks.SingleRunCommand(
            ["omicsscreen", "screen", "p.csv", "--part", "2/4", "--out", "part2", "--resume", "--force", "--out=x", "--part=1/2", "--seed", "7"], "merged");
        Assert.Equal(["omicsscreen", "screen", "p.csv", "--seed", "7", "--out", "merged"], command);
    }

    [Fact]
    public void Parts_of_one_whole_split_pass()
    {
        MergeChecks.CheckTogether([("/a", Part(2, 3)), ("/b", Part(1, 3)), ("/c", Part(3, 3))]);
    }

    [Fact]
    public void A_missing_part_is_named_as_an_input_refusal()
    {
        var e = Assert.Throws<RunRefusedException>(() => MergeChecks.CheckTogether([("/a", Part(1, 3)), ("/c", Part(3, 3))]));
        Assert.Equal(RunRefusal.Input, e.Refusal);
        Assert.Contains("Part 2 of 3 is missing", e.Message);
    }

    [Fact]
    public void A_part_given_twice_names_both_folders()
    {
        var e = Assert.Throws<RunRefusedException>(() => MergeChecks.CheckTogether([("/a", Part(1, 2)), ("/b", Part(1, 2)), ("/c", Part(2, 2))]));
        Assert.Contains("given twice: /a and /b", e.Message);
    }

    [Fact]
    public void Parts_of_different_runs_or_splits_are_refused()
    {
        Assert.Contains("different run", Assert.Throws<RunRefusedException>(
            () => MergeChecks.CheckTogether([("/a", Part(1, 2)), ("/b", Part(2, 2, identity: "run-b"))])).Message);
        Assert.Contains("merge the parts of one split", Assert.Throws<RunRefusedException>(
            () => MergeChecks.CheckTogether([("/a", Part(1, 2)), ("/b", Part(2, 3))])).Message);
    }

    [Fact]
    public void A_results_folder_inside_or_around_a_part_is_an_output_refusal()
    {
        using var folder = new TempFolder();
        string part = Directory.CreateDirectory(Path.Combine(folder.Path, "part1")).FullName;
        var parts = new List<(string, RunRecord)> { (part, Part(1, 1)) };
        Assert.Equal(RunRefusal.Output, Assert.Throws<RunRefusedException>(() => MergeChecks.CheckOutsideParts(part, parts)).Refusal);
        Assert.Equal(RunRefusal.Output, Assert.Throws<RunRefusedException>(() => MergeChecks.CheckOutsideParts(folder.Path, parts)).Refusal);
        Assert.Equal(RunRefusal.Output, Assert.Throws<RunRefusedException>(() => MergeChecks.CheckOutsideParts(Path.Combine(part, "out"), parts)).Refusal);
        MergeChecks.CheckOutsideParts(Path.Combine(folder.Path, "merged"), parts);
    }
}
