using OmicsScreen.Engine.Parallelism;

namespace OmicsScreen.Screening.Importance;

/// <summary>Scores the trees of a forest on worker threads, one worker state per thread.</summary>
internal static class TreeWork
{
    /// <summary>
    /// Hands trees 0..treeCount-1 out by an atomic counter to workers made by createWorker; work
    /// stores each tree's result by tree index, so which thread scores a tree never matters.
    /// </summary>
    public static void ForEach<TWorker>(int treeCount, int threadCount, Func<TWorker> createWorker, Action<TWorker, int> work)
    {
        int threads = Math.Max(1, Math.Min(WorkerThreads.Resolve(threadCount), treeCount));
        int nextTree = -1;
        Parallel.For(0, threads, new ParallelOptions { MaxDegreeOfParallelism = threads }, _ =>
        {
            var worker = createWorker();
            int tree;
            while ((tree = Interlocked.Increment(ref nextTree)) < treeCount) work(worker, tree);
        });
    }
}
