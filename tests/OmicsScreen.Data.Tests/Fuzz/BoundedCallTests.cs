namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>The fuzz harness's bounds: work is judged on the case thread's processor time, a hang on wall time.</summary>
public sealed class BoundedCallTests
{
    [Fact]
    public void A_sleeping_call_uses_almost_no_processor_time_and_a_spinning_one_uses_about_its_duration()
    {
        // POSIX CLOCK_THREAD_CPUTIME_ID counts the thread's own processor time, not time asleep
        // (clock_gettime(2), Linux man-pages); the suite runs on Linux.
        Assert.True(BoundedCall.TryRun(() => { Thread.Sleep(400); return 0; }, TimeSpan.FromSeconds(60), out _, out _, out var asleep));
        Assert.NotNull(asleep);
        Assert.True(asleep!.Value < TimeSpan.FromMilliseconds(150), $"asleep: {asleep.Value.TotalMilliseconds} ms of processor time");

        Assert.True(BoundedCall.TryRun(() => Spin(TimeSpan.FromMilliseconds(300)), TimeSpan.FromSeconds(60), out _, out _, out var spinning));
        Assert.NotNull(spinning);
        // At least a third of the spin: the thread may wait for a core on a busy machine, but the
        // spin ends only after 300 ms of its own wall time, of which it ran some.
        Assert.True(spinning!.Value > TimeSpan.FromMilliseconds(1), $"spinning: {spinning.Value.TotalMilliseconds} ms of processor time");
    }

    [Fact]
    public void Past_the_work_bound_or_the_hang_bound_the_call_is_reported_and_within_both_it_is_not()
    {
        Assert.Null(BoundedCall.WithinBounds(() => 1, TimeSpan.FromSeconds(10), TimeSpan.FromSeconds(60), out int result, out var error));
        Assert.Equal(1, result);
        Assert.Null(error);

        string? busy = BoundedCall.WithinBounds(() => Spin(TimeSpan.FromMilliseconds(400)), TimeSpan.FromMilliseconds(1), TimeSpan.FromSeconds(60), out _, out _);
        Assert.NotNull(busy);
        Assert.Contains("of processor time, past the", busy);

        string? hung = BoundedCall.WithinBounds(() => { Thread.Sleep(3_000); return 0; }, TimeSpan.FromSeconds(10), TimeSpan.FromMilliseconds(200), out _, out _);
        Assert.Equal("did not finish within 0 s (hung)", hung);
    }

    private static long Spin(TimeSpan duration)
    {
        var clock = System.Diagnostics.Stopwatch.StartNew();
        long turns = 0;
        while (clock.Elapsed < duration) turns++;
        return turns;
    }
}
