using System.Globalization;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Resident memory of this process from /proc/self/status (VmRSS now, VmHWM the high-water mark);
/// elsewhere the runtime's working-set figures.
/// </summary>
public static class ProcessMemory
{
    private const string StatusPath = "/proc/self/status";

    public static long PeakBytes() => ReadStatus("VmHWM:") ?? System.Diagnostics.Process.GetCurrentProcess().PeakWorkingSet64;

    public static long CurrentBytes() => ReadStatus("VmRSS:") ?? System.Diagnostics.Process.GetCurrentProcess().WorkingSet64;

    /// <summary>
    /// Sets the high-water mark back to the current resident size (Linux 4.0+: writing "5" to
    /// /proc/self/clear_refs), so a later <see cref="PeakBytes"/> covers only what follows.
    /// Returns false where that is not possible; the peak then covers the whole process.
    /// </summary>
    public static bool TryResetPeak()
    {
        try
        {
            File.WriteAllText("/proc/self/clear_refs", "5");
            return true;
        }
        catch (Exception error) when (error is IOException or UnauthorizedAccessException or NotSupportedException)
        {
            return false;
        }
    }

    private static long? ReadStatus(string field)
    {
        if (!File.Exists(StatusPath)) return null;
        foreach (var line in File.ReadLines(StatusPath))
            if (line.StartsWith(field, StringComparison.Ordinal))
                return long.Parse(line[field.Length..].Trim().Split(' ')[0], CultureInfo.InvariantCulture) * 1024;
        return null;
    }
}
