using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// How a calibration model turns each sample's log hazard into censored follow-up: exponential
/// event times with hazard BaselineHazard x exp(eta) (a Cox model with a constant baseline
/// hazard), independent exponential censoring, and optionally follow-up recorded only in whole
/// units (coarse visits, so many times tie).
/// </summary>
/// <remarks>
/// With eta = 0 for every sample the censored share is CensoringHazard / (BaselineHazard +
/// CensoringHazard), the chance that the censoring clock rings first (a race of two independent
/// exponentials; common practice). Times are in years: a baseline hazard of 0.1 is a median
/// event-free time of ln 2 / 0.1 = 6.9 years.
/// </remarks>
public sealed record FollowUpDesign
{
    public double BaselineHazard { get; init; } = 0.1;

    public required double CensoringHazard { get; init; }

    /// <summary>Follow-up is rounded up to a whole number of these units (events and censoring alike); null keeps exact times.</summary>
    public double? TimeUnit { get; init; }

    /// <summary>The design whose censored share is <paramref name="share"/> when no sample's hazard differs from the baseline.</summary>
    public static FollowUpDesign WithCensoredShare(double share, double baselineHazard = 0.1)
    {
        if (!(share > 0 && share < 1)) throw new ArgumentOutOfRangeException(nameof(share), "The censored share must lie in (0, 1).");
        return new FollowUpDesign { BaselineHazard = baselineHazard, CensoringHazard = baselineHazard * share / (1 - share) };
    }

    /// <summary>The share censored when every log hazard is 0.</summary>
    public double NullCensoredShare => CensoringHazard / (BaselineHazard + CensoringHazard);

    /// <summary>
    /// Follow-up of every sample: event time -ln(1 - U) / (h0 exp(eta)) by inversion, censoring
    /// time -ln(1 - V) / hc, observed time the smaller, event when the event came first (a tie,
    /// of probability 0, counts as an event). Two draws per sample in sample order.
    /// </summary>
    public DrawnOutcome Draw(ReadOnlySpan<double> logHazard, ref Xoshiro256StarStar generator)
    {
        var times = new double[logHazard.Length];
        var events = new bool[logHazard.Length];
        for (int s = 0; s < times.Length; s++)
        {
            double eventTime = -Math.Log(1 - generator.NextDouble()) / (BaselineHazard * Math.Exp(logHazard[s]));
            double censoringTime = -Math.Log(1 - generator.NextDouble()) / CensoringHazard;
            events[s] = eventTime <= censoringTime;
            double time = Math.Min(eventTime, censoringTime);
            // Rounding up keeps every time positive and leaves the order of distinct visits intact.
            times[s] = TimeUnit is { } unit ? Math.Ceiling(time / unit) * unit : time;
        }
        return DrawnOutcome.OfFollowUp(times, events);
    }
}
