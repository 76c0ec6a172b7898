namespace OmicsScreen.Engine.Parallelism;

/// <summary>
/// The one reading of a thread-count setting: a positive count is taken as it is, 0 (the
/// default of every verb's --threads) means every core the process may use.
/// </summary>
public static class WorkerThreads
{
    public static int Resolve(int requested)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(requested);
        return requested > 0 ? requested : Environment.ProcessorCount;
    }

    /// <summary>Options for Parallel.For that honour the setting.</summary>
    public static ParallelOptions Options(int requested) => new() { MaxDegreeOfParallelism = Resolve(requested) };
}
