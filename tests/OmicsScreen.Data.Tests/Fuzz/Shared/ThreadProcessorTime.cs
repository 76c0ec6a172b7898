using System.Runtime.InteropServices;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// The processor time the calling thread has used, from the kernel's per-thread clock
/// (clock_gettime with CLOCK_THREAD_CPUTIME_ID, POSIX), or null where that clock cannot be read.
/// </summary>
/// <remarks>
/// Why: a time bound on a loader case is meant to catch work that goes pathological, and wall time
/// on a shared two-core machine at load 30-46 stretched a case of a few hundred processor
/// milliseconds past 40 s. The thread's own processor time does not grow while the thread waits
/// for a core.
/// </remarks>
internal static partial class ThreadProcessorTime
{
    private const int ClockThreadCpuTimeId = 3; // Linux <time.h>

    [StructLayout(LayoutKind.Sequential)]
    private struct TimeSpec
    {
        public long Seconds;
        public long Nanoseconds;
    }

    [LibraryImport("libc", EntryPoint = "clock_gettime")]
    private static partial int ClockGetTime(int clock, out TimeSpec time);

    public static TimeSpan? Now()
    {
        if (!OperatingSystem.IsLinux() || !Environment.Is64BitProcess) return null;
        try
        {
            if (ClockGetTime(ClockThreadCpuTimeId, out var time) != 0) return null;
            return TimeSpan.FromTicks(time.Seconds * TimeSpan.TicksPerSecond + time.Nanoseconds / 100);
        }
        catch (DllNotFoundException) { return null; }
        catch (EntryPointNotFoundException) { return null; }
    }
}
