using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Forests;

/// <summary>Everything that decides a forest: with the same panel and options, the same trees, always.</summary>
public sealed record ForestOptions
{
    public int TreeCount { get; init; } = 500;
    public TreeOptions Tree { get; init; } = TreeOptions.Default;
    public SamplingOptions Sampling { get; init; } = SamplingOptions.Default;

    /// <summary>Worker threads; 0 uses every core. Never changes the result, only the time.</summary>
    public int ThreadCount { get; init; }

    /// <summary>The run seed from which every random stream is derived (see <see cref="Randomness.SeedSchedule"/>).</summary>
    public ulong Seed { get; init; } = 1;

    /// <summary>Which repeat of a screening run this forest is; a second coordinate of every stream.</summary>
    public int Repeat { get; init; }

    public static ForestOptions Default { get; } = new();

    public int ResolveThreadCount() => WorkerThreads.Resolve(ThreadCount);

    public void Validate(int sampleCount)
    {
        if (TreeCount < 1) throw new ArgumentException("A forest needs at least one tree.");
        if (ThreadCount < 0) throw new ArgumentException("The thread count cannot be negative.");
        if (Repeat < 0) throw new ArgumentException("The repeat index cannot be negative.");
        Tree.Validate();
        Sampling.Validate(sampleCount);
    }
}
