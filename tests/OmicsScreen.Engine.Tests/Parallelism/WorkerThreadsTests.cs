using OmicsScreen.Engine.Parallelism;

namespace OmicsScreen.Engine.Tests.Parallelism;

public class WorkerThreadsTests
{
    [Fact]
    public void Zero_means_every_core_and_a_count_is_kept()
    {
        // The --threads convention of every verb (README: "0 = all cores").
        Assert.Equal(Environment.ProcessorCount, WorkerThreads.Resolve(0));
        Assert.Equal(3, WorkerThreads.Resolve(3));
        Assert.Equal(Environment.ProcessorCount, WorkerThreads.Options(0).MaxDegreeOfParallelism);
        Assert.Throws<ArgumentOutOfRangeException>(() => WorkerThreads.Resolve(-1));
    }
}
