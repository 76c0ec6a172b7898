using System.Runtime.CompilerServices;
using Xunit.Abstractions;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>The fuzz harness's stall watchdog catches a case that runs too long, and stays quiet otherwise.</summary>
public sealed class StallWatchdogTests
{
    private readonly ITestOutputHelper _output;

    public StallWatchdogTests(ITestOutputHelper output) => _output = output;

    [Fact]
    public void A_case_that_outlives_the_limit_leaves_the_stacks_of_every_thread_taken_during_the_stall()
    {
        // Linux is where the suite runs (CI included); createdump ships beside the runtime there.
        using var watchdog = StallWatchdog.TryStart(TimeSpan.FromSeconds(2), withHeap: false);
        Assert.NotNull(watchdog);
        watchdog.Begin("case 7 of master seed 11");
        StallingCase(TimeSpan.FromSeconds(6));
        watchdog.End();

        string? stall = watchdog.FindStall();
        Assert.NotNull(stall);
        _output.WriteLine(stall);
        Assert.Contains("case 7 of master seed 11 ran longer than 2 s", stall);
        // The stalled thread's own frame, as createdump's crash report names it.
        Assert.Contains("OmicsScreen.Data.Tests.Fuzz.StallWatchdogTests.StallingCase", stall);
        // The message names the stacks file after "taken during the stall: " (the collector counts before it hold ": " too).
        string stacksFile = stall.Split("taken during the stall: ", 2)[1].Split(" (", 2)[0];
        Assert.True(File.Exists(stacksFile), stacksFile);
        Assert.StartsWith(Path.GetTempPath(), stacksFile, StringComparison.Ordinal);
        Directory.Delete(Path.GetDirectoryName(stacksFile)!, recursive: true);
    }

    [Fact]
    public void Quick_cases_leave_no_stall_and_no_files()
    {
        var watchdog = StallWatchdog.TryStart(TimeSpan.FromSeconds(30), withHeap: false);
        Assert.NotNull(watchdog);
        for (int number = 0; number < 20; number++)
        {
            watchdog.Begin($"case {number}");
            watchdog.End();
            Assert.Null(watchdog.FindStall());
        }
        Assert.True(Directory.Exists(watchdog.Folder));
        watchdog.Dispose();
        Assert.False(Directory.Exists(watchdog.Folder));
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void StallingCase(TimeSpan duration) => Thread.Sleep(duration);
}
