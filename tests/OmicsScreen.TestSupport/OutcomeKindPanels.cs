using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport;

/// <summary>
/// Invented panels with a measured or a time-to-event outcome and known truth (a design of our
/// own; common practice for checking a screen), shared by the outcome-kind screen tests and the
/// shuffled-outcome benchmark so both draw the very same panels. Features are standard normal
/// (<see cref="StandardNormalFeatures"/>); markers 0-2 planted, the rest noise. Measured:
/// y = 1.0 z0 + 0.8 z1 + 1.2 [z2 &gt; 0.5] + e, e ~ N(0, 1). Follow-up: exponential event times
/// with log hazard 0.8 z0 + 0.7 z1 + 1.0 [z2 &gt; 0.5] and independent exponential censoring at
/// rate 0.5 (about a third censored). Without planted markers the outcome ignores every feature.
/// </summary>
public static class OutcomeKindPanels
{
    public static Panel Measured(int samples, int features, ulong seed, bool planted)
    {
        var (matrix, z, _) = StandardNormalFeatures.Draw(samples, features, seed, s => $"S{s:D3}");
        var noise = SeedSchedule.Generator(seed, 1, 0, SeedPurpose.Sampling);
        var y = new double[samples];
        for (int s = 0; s < samples; s++)
            y[s] = (planted ? 1.0 * z[0][s] + 0.8 * z[1][s] + (z[2][s] > 0.5 ? 1.2 : 0) : 0) + noise.NextGaussian();
        return new Panel(matrix, new MeasuredOutcome("score", y));
    }

    public static Panel FollowUp(int samples, int features, ulong seed, bool planted)
    {
        var (matrix, z, _) = StandardNormalFeatures.Draw(samples, features, seed, s => $"S{s:D3}");
        var draws = SeedSchedule.Generator(seed, 2, 0, SeedPurpose.Sampling);
        var times = new double[samples];
        var events = new bool[samples];
        for (int s = 0; s < samples; s++)
        {
            double logHazard = planted ? 0.8 * z[0][s] + 0.7 * z[1][s] + (z[2][s] > 0.5 ? 1.0 : 0) : 0;
            double eventTime = -Math.Log(1 - draws.NextDouble()) / Math.Exp(logHazard);
            double censorTime = -Math.Log(1 - draws.NextDouble()) / 0.5;
            times[s] = Math.Min(eventTime, censorTime);
            events[s] = eventTime <= censorTime;
        }
        return new Panel(matrix, new FollowUpOutcome("months", "relapse", times, events));
    }

    /// <summary>The panel with its outcome (value, or time with its event) moved to a random other sample: every feature null.</summary>
    public static Panel Shuffled(Panel panel, ulong seed)
    {
        int n = panel.SampleCount;
        var order = Enumerable.Range(0, n).ToArray();
        SeedSchedule.Generator(seed, 3, 0, SeedPurpose.Sampling).Shuffle(order.AsSpan());
        if (panel.Kind == OutcomeKind.Measured)
        {
            var y = panel.Measured!.Values.ToArray();
            return new Panel(panel.Matrix, new MeasuredOutcome("score", order.Select(i => y[i]).ToArray()));
        }
        var times = panel.FollowUp!.Times.ToArray();
        var events = panel.FollowUp.Events.ToArray();
        return new Panel(panel.Matrix, new FollowUpOutcome("months", "relapse",
            order.Select(i => times[i]).ToArray(), order.Select(i => events[i]).ToArray()));
    }
}
