using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Cli.Tests.Work;

namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// Faults that need real processes: two screens started into one folder (issue 13, finding 3)
/// and a screen killed while writing its tables (finding 15). Every wait is bounded.
/// </summary>
public sealed class ProcessFaultTests : IDisposable
{
    private static readonly TimeSpan Bound = TimeSpan.FromMinutes(3);

    private readonly MisuseScene _scene = new();

    public void Dispose() => _scene.Dispose();

    private static string[] LongerScreen(string results, string seed) =>
        MisuseScene.SmallScreen(results, "--pairs", "6", "--trees", "150", "--curve-folds", "3", "--curve-inner-pairs", "2", "--seed", seed);

    [Fact]
    public void Two_screens_into_one_folder_leave_exactly_the_run_that_exited_zero()
    {
        string results = _scene.PathOf("shared");
        using var first = ChildProcess.StartCapturing(LongerScreen(results, "11"));
        var clock = Stopwatch.StartNew();
        string lockFile = Path.Combine(results, ".omicsscreen.lock.json");
        while (!File.Exists(lockFile) && !first.Process.HasExited && clock.Elapsed < Bound) Thread.Sleep(5);
        Assert.False(first.Process.HasExited, "the first screen finished before the second started; the test needs a longer run");

        using var second = ChildProcess.StartCapturing(LongerScreen(results, "22"));
        Assert.True(second.Process.WaitForExit((int)Bound.TotalMilliseconds), "the second screen did not end");
        Assert.True(first.Process.WaitForExit((int)Bound.TotalMilliseconds), "the first screen did not end");
        second.Process.WaitForExit();
        first.Process.WaitForExit();

        Assert.True(first.Process.ExitCode == ExitCode.Success, first.Error);
        Assert.True(second.Process.ExitCode == ExitCode.OutputError, second.Error);
        string refusal = second.Error;
        Assert.Contains("in use by another OmicsScreen run", refusal);
        Assert.Contains($"process {first.Process.Id.ToString(CultureInfo.InvariantCulture)}", refusal);
        Assert.DoesNotContain("   at ", refusal);

        string manifest = File.ReadAllText(Path.Combine(results, "manifest.json"));
        Assert.Contains("--seed 11", manifest);
        Assert.DoesNotContain("--seed 22", manifest);
        MisuseCorpus.AssertFolderHoldsOnlyItsManifestOutputs(results);
    }

    [Fact]
    public void A_screen_killed_while_writing_its_tables_leaves_no_temporary_file_after_resume()
    {
        string results = _scene.PathOf("killed");
        using (var captured = ChildProcess.StartCapturing(LongerScreen(results, "5")))
        {
            var child = captured.Process;
            var clock = Stopwatch.StartNew();
            // The tables are written after every work unit is done; the first sign of them is the moment to kill.
            while (!child.HasExited && clock.Elapsed < Bound && !WritingHasBegun(results)) Thread.Sleep(2);
            Assert.False(child.HasExited, "the screen finished before it could be killed");
            child.Kill(entireProcessTree: true);
            child.WaitForExit();
            // A kill lands between two tables more often than inside one; leave what a kill inside
            // one leaves (AtomicFile's temporary name with the dead process's id) so both are covered.
            File.WriteAllText(Path.Combine(results, $".features.tsv.{child.Id.ToString(CultureInfo.InvariantCulture)}.0123456789abcdef0123456789abcdef.partial"), "order\tfea");
        }
        Assert.False(File.Exists(Path.Combine(results, "manifest.json")), "the killed run must not look complete");

        var resumed = CliHarness.Run([.. LongerScreen(results, "5"), "--resume"]);
        Assert.True(resumed.ExitCode == ExitCode.Success, resumed.Error);
        Assert.Empty(Directory.GetFiles(results, "*.partial", SearchOption.AllDirectories));
        Assert.Empty(Directory.GetFiles(results, ".omicsscreen.lock*"));
        MisuseCorpus.AssertFolderHoldsOnlyItsManifestOutputs(results);
    }

    /// <summary>Finding 9: bash's &lt;(...) hands the program /dev/fd/N, a pipe that can be read once; it used to be called blank.</summary>
    [Fact]
    public async Task A_process_substitution_as_the_matrix_is_refused_with_the_fix_not_read_as_blank()
    {
        string dotnet = Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host ? host : "dotnet";
        var info = new ProcessStartInfo("bash") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        info.ArgumentList.Add("-c");
        info.ArgumentList.Add("exec \"$0\" \"$1\" check <(cat \"$2\") --samples \"$3\" --outcome status");
        foreach (var arg in new[] { dotnet, Path.Combine(AppContext.BaseDirectory, "omicsscreen.dll"), _scene.Panel(), _scene.Sheet() })
            info.ArgumentList.Add(arg);
        using var process = Process.Start(info) ?? throw new InvalidOperationException("bash did not start");
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(90));
        var error = process.StandardError.ReadToEndAsync(timeout.Token);
        var output = process.StandardOutput.ReadToEndAsync(timeout.Token);
        try
        {
            await process.WaitForExitAsync(timeout.Token);
        }
        catch (OperationCanceledException)
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail("check of a process substitution did not end within 90 s");
        }
        string message = await error;
        await output;
        Assert.Equal(ExitCode.InputError, process.ExitCode);
        Assert.StartsWith("error: /dev/fd/", message);
        Assert.Contains("is a pipe", message);
        Assert.Contains("Save the stream to a file first", message);
        Assert.DoesNotContain("blank", message);
        Assert.DoesNotContain("   at ", message);
    }

    private static bool WritingHasBegun(string results) =>
        Directory.Exists(results)
        && (File.Exists(Path.Combine(results, "shortlist.tsv")) || Directory.GetFiles(results, ".shortlist.tsv.*.partial").Length > 0);
}
