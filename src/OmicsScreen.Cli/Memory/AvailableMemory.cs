using System.Globalization;

namespace OmicsScreen.Cli.Memory;

/// <summary>
/// How much memory this process may still take before the system kills it: the smallest of the
/// kernel's available memory, the control group's limit less its usage, and what the .NET
/// collector is allowed to use.
/// </summary>
/// <remarks>
/// MemAvailable is the kernel's estimate of memory available for new work without swapping
/// (Linux Documentation/filesystems/proc.rst, /proc/meminfo). Containers and job schedulers
/// limit memory with control groups: memory.max and memory.current in cgroup v2 ("max" means no
/// limit), memory.limit_in_bytes and memory.usage_in_bytes in v1 (a huge number means none).
/// </remarks>
internal static class AvailableMemory
{
    /// <summary>cgroup v1 reports "no limit" as the largest page-aligned long; any limit this high is none.</summary>
    private const long NoLimitAbove = 1L << 60;

    /// <summary>Bytes available, or null when nothing could be read.</summary>
    public static long? Bytes()
    {
        long? smallest = null;
        void Consider(long? bytes)
        {
            if (bytes is { } b && (smallest is null || b < smallest)) smallest = b;
        }
        Consider(FromMeminfo(ReadOrNull("/proc/meminfo")));
        Consider(CgroupHeadroom(ReadOrNull("/sys/fs/cgroup/memory.max"), ReadOrNull("/sys/fs/cgroup/memory.current")));
        Consider(CgroupHeadroom(ReadOrNull("/sys/fs/cgroup/memory/memory.limit_in_bytes"),
            ReadOrNull("/sys/fs/cgroup/memory/memory.usage_in_bytes")));
        long collector = GC.GetGCMemoryInfo().TotalAvailableMemoryBytes;
        if (collector > 0) Consider(collector);
        return smallest;
    }

    /// <summary>MemAvailable of /proc/meminfo in bytes (the file gives kB); null when absent.</summary>
    internal static long? FromMeminfo(string? text)
    {
        if (text is null) return null;
        foreach (var line in text.Split('\n'))
        {
            if (!line.StartsWith("MemAvailable:", StringComparison.Ordinal)) continue;
            var fields = line["MemAvailable:".Length..].Split(' ', StringSplitOptions.RemoveEmptyEntries);
            if (fields.Length >= 1 && long.TryParse(fields[0], NumberStyles.None, CultureInfo.InvariantCulture, out long kilobytes))
                return kilobytes * 1024;
        }
        return null;
    }

    /// <summary>A control group's limit less its current usage; null when there is no limit or it cannot be read.</summary>
    internal static long? CgroupHeadroom(string? limitText, string? usageText)
    {
        if (limitText is null) return null;
        string limit = limitText.Trim();
        if (limit == "max" || !long.TryParse(limit, NumberStyles.None, CultureInfo.InvariantCulture, out long limitBytes)
            || limitBytes >= NoLimitAbove)
            return null;
        long usage = usageText is not null && long.TryParse(usageText.Trim(), NumberStyles.None, CultureInfo.InvariantCulture, out long used)
            ? used : 0;
        return Math.Max(0, limitBytes - usage);
    }

    private static string? ReadOrNull(string path)
    {
        try
        {
            return File.Exists(path) ? File.ReadAllText(path) : null;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return null;
        }
    }
}
