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
    public static bool TryRun<T>(Func<T> call, TimeSpan bound, out T? result, out Exception? error)
    {
        T? value = default;
        Exception? thrown = null;
        var thread = new Thread(() =>
        {
            try { value = call(); }
            catch (Exception e) { thrown = e; }
        })
        { IsBackground = true, Name = "bounded fuzz case" };
        thread.Start();
        bool finished = thread.Join(bound);
        result = finished ? value : default;
        error = finished ? thrown : null;
        return finished;
    }
}
