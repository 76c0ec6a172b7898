using OmicsScreen.Cli.Memory;

namespace OmicsScreen.Cli.Tests.Memory;

public class AvailableMemoryTests
{
    [Fact]
    public void MemAvailable_is_read_from_proc_meminfo_in_kilobytes()
    {
        // Layout of /proc/meminfo (Linux Documentation/filesystems/proc.rst): "Name:   value kB".
        const string meminfo = "MemTotal:       24683520 kB\nMemFree:        22349712 kB\nMemAvailable:   24146276 kB\nBuffers:  1 kB\n";

        Assert.Equal(24146276L * 1024, AvailableMemory.FromMeminfo(meminfo));
        Assert.Null(AvailableMemory.FromMeminfo("MemTotal: 1 kB\n"));
        Assert.Null(AvailableMemory.FromMeminfo(null));
    }

    [Fact]
    public void A_control_group_limit_leaves_its_limit_less_its_usage()
    {
        // cgroup v2 memory.max holds "max" when unlimited; v1 reports no limit as 9223372036854771712.
        Assert.Equal(1_000_000_000L, AvailableMemory.CgroupHeadroom("1073741824\n", "73741824\n"));
        Assert.Null(AvailableMemory.CgroupHeadroom("max\n", "73741824\n"));
        Assert.Null(AvailableMemory.CgroupHeadroom("9223372036854771712", "1000"));
        Assert.Equal(0L, AvailableMemory.CgroupHeadroom("1000", "5000"));
        Assert.Equal(4096L, AvailableMemory.CgroupHeadroom("4096", null));
        Assert.Null(AvailableMemory.CgroupHeadroom(null, "1000"));
    }

    [Fact]
    public void This_machine_reports_some_available_memory()
    {
        long? available = AvailableMemory.Bytes();

        Assert.NotNull(available);
        Assert.True(available > 0);
    }
}
