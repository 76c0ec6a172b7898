using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Benchmarks;

/// <summary>Processor time between stage starts, recorded synchronously on the reporting thread.</summary>
/// <remarks>
/// A stage's processor time runs from its first progress report to the next stage's, so the
/// aggregation that follows the repeats is counted with the repeats.
/// </remarks>
internal sealed class StageProcessorTimes : IProgress<ScreenProgress>
{
    private readonly ProcessorClock _clock = ProcessorClock.Start();
    private ScreenStage? _current;

    public List<(ScreenStage Stage, double Seconds)> Seconds { get; } = [];

    public void Report(ScreenProgress value)
    {
        if (_current == value.Stage) return;
        double lap = _clock.Lap();
        if (_current is { } previous) Seconds.Add((previous, lap));
        _current = value.Stage;
    }

    public void Finish()
    {
        if (_current is { } last) Seconds.Add((last, _clock.Lap()));
        _current = null;
    }
}
