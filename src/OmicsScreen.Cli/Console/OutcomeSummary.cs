using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Cli.Console;

/// <summary>
/// What `check` says about an outcome that is not classes: the spread of a measured quantity, or
/// the events, censoring and Kaplan-Meier medians of a time to an event. Null parts do not apply.
/// </summary>
internal sealed record OutcomeSummary
{
    public required OutcomeKind Kind { get; init; }
    public MeasuredSummary? Measured { get; init; }
    public FollowUpSummary? FollowUp { get; init; }

    public static OutcomeSummary Of(Panel panel) => new()
    {
        Kind = panel.Kind,
        Measured = panel.Measured is { } measured ? MeasuredSummary.Of(measured) : null,
        FollowUp = panel.FollowUp is { } followUp ? FollowUpSummary.Of(followUp) : null,
    };
}

/// <param name="Missing">Samples without a value; always 0 here, since a missing measured outcome stops the load at its line.</param>
/// <param name="LowerQuartile">Quartiles by Hyndman and Fan's type 7 (the default of R and numpy).</param>
internal sealed record MeasuredSummary(int Samples, int Missing, double Min, double LowerQuartile, double Median,
    double UpperQuartile, double Max)
{
    public static MeasuredSummary Of(MeasuredOutcome outcome)
    {
        var sorted = outcome.Values.ToArray();
        Array.Sort(sorted);
        return new MeasuredSummary(sorted.Length, 0, sorted[0],
            Quantile.OfSorted(sorted, 0.25, QuantileDefinition.Linear),
            Quantile.OfSorted(sorted, 0.5, QuantileDefinition.Linear),
            Quantile.OfSorted(sorted, 0.75, QuantileDefinition.Linear), sorted[^1]);
    }
}

/// <param name="TiedEventTimes">Event times shared by two or more events (ties that Breslow or Efron handling must resolve).</param>
/// <param name="MedianSurvival">Kaplan-Meier median; null when the curve stays above one half ("not reached").</param>
/// <param name="MedianFollowUp">Reverse Kaplan-Meier median follow-up (Schemper and Smith 1996); null when not reached.</param>
internal sealed record FollowUpSummary(int Samples, int Events, int Censored, int TiedEventTimes, double? MedianSurvival,
    double? MedianFollowUp)
{
    public static FollowUpSummary Of(FollowUpOutcome outcome)
    {
        var times = outcome.Times;
        var events = outcome.Events;
        var curve = KaplanMeier.Estimate(times, events);
        int tied = 0;
        foreach (int count in curve.Events)
            if (count > 1) tied++;
        int eventCount = outcome.EventCount;
        return new FollowUpSummary(outcome.SampleCount, eventCount, outcome.SampleCount - eventCount, tied,
            NullWhenNaN(curve.Median), NullWhenNaN(KaplanMeier.MedianFollowUp(times, events)));
    }

    private static double? NullWhenNaN(double value) => double.IsNaN(value) ? null : value;
}
