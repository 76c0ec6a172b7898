using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Screen;

/// <summary>Harrell's C of a risk score over some of a follow-up's samples.</summary>
internal static class SampleConcordance
{
    /// <summary>Harrell's C over <paramref name="samples"/>; NaN with no comparable pair.</summary>
    /// <param name="risk">The risk of a sample, or with <paramref name="byPosition"/> of the i-th of <paramref name="samples"/>.</param>
    public static double Of(FollowUpTimes followUp, IReadOnlyList<int> samples, Func<int, double> risk, bool byPosition = false)
    {
        var times = followUp.Times;
        var events = followUp.Events;
        var t = new double[samples.Count];
        var e = new bool[samples.Count];
        var r = new double[samples.Count];
        for (int i = 0; i < samples.Count; i++)
        {
            t[i] = times[samples[i]];
            e[i] = events[samples[i]];
            r[i] = risk(byPosition ? i : samples[i]);
        }
        var estimate = HarrellConcordance.Estimate(t, e, r);
        return estimate.ComparablePairs == 0 ? double.NaN : estimate.Concordance;
    }
}
