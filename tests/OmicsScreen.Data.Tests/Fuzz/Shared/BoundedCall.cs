namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// Runs a call on a thread of its own and waits for it at most a given time. A dedicated
/// thread, not the thread pool: the loader itself queues work on the pool, and a harness that
/// blocked pool threads while waiting could starve it into a false "hang" on a busy machine.
/// </summary>
internal static class BoundedCall
{
    /// <summary>
    /// False when the call did not end within <paramref name="bound"/> (its thread is a background
    /// thread, left to finish or to die with the process); otherwise its result or exception.
    /// </summary>
    public static bool TryRun<T>(Func<T> call, TimeSpan bound, out T? result, out Exception? error) =>
        TryRun(call, bound, out result, out error, out _);

    /// <summary>
    /// As <see cref="TryRun{T}(Func{T}, TimeSpan, out T, out Exception)"/>, also giving the processor
    /// time the call's own thread used (<see cref="ThreadProcessorTime"/>; null where it cannot be read
    /// or the call did not end).
    /// </summary>
    public static bool TryRun<T>(Func<T> call, TimeSpan bound, out T? result, out Exception? error, out TimeSpan? processorTime)
    {
        T? value = default;
        Exception? thrown = null;
        TimeSpan? used = null;
        var thread = new Thread(() =>
        {
            var start = ThreadProcessorTime.Now();
            try { value = call(); }
            catch (Exception e) { thrown = e; }
            if (start is { } begun && ThreadProcessorTime.Now() is { } ended) used = ended - begun;
        })
        { IsBackground = true, Name = "bounded fuzz case" };
        thread.Start();
        bool finished = thread.Join(bound);
        result = finished ? value : default;
        error = finished ? thrown : null;
        processorTime = finished ? used : null;
        return finished;
    }

    /// <summary>
    /// Runs the call with a bound on the work it does and a bound on how long it may hang: null when
    /// it ended within both, else what went past. The work is the processor time of the call's own
    /// thread where that can be read, else its wall time; the hang bound is wall time.
    /// </summary>
    public static string? WithinBounds<T>(Func<T> call, TimeSpan workBound, TimeSpan hangBound, out T? result, out Exception? error)
    {
        var clock = System.Diagnostics.Stopwatch.StartNew();
        if (!TryRun(call, hangBound, out result, out error, out var processorTime))
            return $"did not finish within {hangBound.TotalSeconds:0} s (hung)";
        if (processorTime is { } used)
            return used > workBound ? $"used {used.TotalSeconds:0.0} s of processor time, past the {workBound.TotalSeconds:0} s bound" : null;
        return clock.Elapsed > workBound ? $"took {clock.Elapsed.TotalSeconds:0.0} s, past the {workBound.TotalSeconds:0} s bound" : null;
    }
}
