using System.Diagnostics;

namespace OmicsScreen.Benchmarks;

/// <summary>Processor time of this process (all threads), read in laps.</summary>
public sealed class ProcessorClock
{
    private readonly Process _process = Process.GetCurrentProcess();
    private TimeSpan _last;

    private ProcessorClock() => _last = Now();

    public static ProcessorClock Start() => new();

    /// <summary>Processor seconds since the start or the previous lap.</summary>
    public double Lap()
    {
        var now = Now();
        double seconds = (now - _last).TotalSeconds;
        _last = now;
        return seconds;
    }

    private TimeSpan Now()
    {
        _process.Refresh();
        return _process.TotalProcessorTime;
    }
}
