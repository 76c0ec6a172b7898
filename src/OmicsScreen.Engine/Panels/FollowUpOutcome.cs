using OmicsScreen.Engine.Survival;

namespace OmicsScreen.Engine.Panels;

/// <summary>
/// A censored time to an event as the outcome: per sample the follow-up time and whether the
/// event was observed at its end (false: censored), from two named columns.
/// </summary>
public sealed class FollowUpOutcome
{
    public FollowUpOutcome(string timeColumn, string eventColumn, ReadOnlySpan<double> times, ReadOnlySpan<bool> events)
    {
        ArgumentNullException.ThrowIfNull(timeColumn);
        ArgumentNullException.ThrowIfNull(eventColumn);
        TimeColumn = timeColumn;
        EventColumn = eventColumn;
        FollowUp = new FollowUpTimes(times, events);
    }

    public string TimeColumn { get; }
    public string EventColumn { get; }

    /// <summary>Times and events indexed for survival trees (distinct event times, risk sets).</summary>
    public FollowUpTimes FollowUp { get; }

    public int SampleCount => FollowUp.SampleCount;
    public ReadOnlySpan<double> Times => FollowUp.Times;
    public ReadOnlySpan<bool> Events => FollowUp.Events;
    public int EventCount => FollowUp.EventCount;

    public FollowUpOutcome SelectSamples(ReadOnlySpan<int> samples)
    {
        var selected = FollowUp.SelectSamples(samples);
        return new FollowUpOutcome(TimeColumn, EventColumn, selected.Times, selected.Events);
    }
}
