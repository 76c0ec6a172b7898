namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// Runs every case of the misuse corpus: the documented exit code, a message naming the place and
/// the fix, never a stack trace, and every file that was there before byte-identical afterwards
/// (a refused run creates nothing either). Each run is bounded in time: a FIFO a run got stuck on
/// is opened from here so the run is let go, and the case fails.
/// </summary>
public sealed class MisuseCorpusTests
{
    private static readonly TimeSpan Bound = TimeSpan.FromSeconds(120);

    public static TheoryData<string> CaseNames()
    {
        var names = new TheoryData<string>();
        foreach (var misuse in MisuseCorpus.All()) names.Add(misuse.Name);
        return names;
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Ends_with_its_exit_code_and_message_and_changes_nothing_it_did_not_write(string name)
    {
        var misuse = MisuseCorpus.All().Single(c => c.Name == name);
        using var scene = new MisuseScene();
        string[] arguments = misuse.Arrange(scene);
        var before = FolderSnapshot.Take(scene.Root);
        var mayWrite = misuse.MayWrite?.Invoke(scene);

        // A dedicated thread, not the pool, so a busy pool cannot pass for a hang.
        CliHarness.Outcome? outcome = null;
        var running = new Thread(() => outcome = CliHarness.Run(arguments)) { IsBackground = true };
        running.Start();
        if (!running.Join(Bound))
        {
            scene.ReleaseFifos();
            running.Join(TimeSpan.FromSeconds(10));
            Assert.Fail($"{name}: the run did not end within {Bound.TotalSeconds} s");
        }
        var run = outcome!;

        Assert.True(misuse.ExitCode == run.ExitCode, $"{name}: exit {run.ExitCode}, expected {misuse.ExitCode}\n{run.Error}\n{run.Out}");
        string message = run.Out + run.Error;
        foreach (var fragment in misuse.Fragments) Assert.Contains(fragment, message, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("   at ", message);
        Assert.DoesNotContain("Exception", run.Error);
        // `check` prints its findings as a table and its verdict after them; every other refusal is one "error:" message.
        if (misuse.ExitCode != ExitCode.Success && arguments[0] != "check") Assert.StartsWith("error: ", run.Error);

        var after = FolderSnapshot.Take(scene.Root);
        var change = before.FirstChangeIn(after, newEntriesAllowed: misuse.ExitCode == ExitCode.Success, mayWrite);
        Assert.True(change is null, $"{name}: {change}");
        misuse.Verify?.Invoke(scene, run);
    }
}
