using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Resampling;

/// <summary>
/// The stratum of every sample that half-samples and outer folds keep balanced: the class for a
/// class outcome, the quarter of the outcome's range (by rank) for a measured one, and whether
/// the event was seen for a follow-up. Stratifying keeps each half and each fold a fair copy of
/// the whole, so a fold of a censored study is not left without events, nor a fold of a measured
/// outcome without its high values (common practice).
/// </summary>
public sealed class ResamplingStrata
{
    private readonly int[] _sampleStrata;

    private ResamplingStrata(int[] sampleStrata, int stratumCount)
    {
        _sampleStrata = sampleStrata;
        StratumCount = stratumCount;
    }

    /// <summary>Stratum code of each sample, 0 to <see cref="StratumCount"/> - 1.</summary>
    public ReadOnlySpan<int> SampleStrata => _sampleStrata;

    public int StratumCount { get; }

    /// <summary>Quarters of a measured outcome: enough strata to balance the range, few enough to be filled on small panels.</summary>
    public const int MeasuredStratumCount = 4;

    public static ResamplingStrata Of(Panel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        return panel.Kind switch
        {
            OutcomeKind.Measured => Of(panel.Measured!),
            OutcomeKind.TimeToEvent => Of(panel.FollowUp!),
            _ => Of(panel.Outcome),
        };
    }

    public static ResamplingStrata Of(ClassOutcome outcome)
    {
        ArgumentNullException.ThrowIfNull(outcome);
        return new ResamplingStrata(outcome.SampleClasses.ToArray(), outcome.ClassCount);
    }

    /// <summary>
    /// Quarters by rank: the sample at rank r (0-based, ties broken by sample order so the strata
    /// never depend on a sort's stability) goes to stratum floor(4 r / n).
    /// </summary>
    public static ResamplingStrata Of(MeasuredOutcome outcome)
    {
        ArgumentNullException.ThrowIfNull(outcome);
        var values = outcome.Values.ToArray();
        int count = values.Length;
        var order = new int[count];
        for (int s = 0; s < count; s++) order[s] = s;
        Array.Sort(order, (a, b) => values[a] != values[b] ? values[a].CompareTo(values[b]) : a.CompareTo(b));
        var strata = new int[count];
        for (int rank = 0; rank < count; rank++) strata[order[rank]] = (int)((long)MeasuredStratumCount * rank / count);
        return new ResamplingStrata(strata, MeasuredStratumCount);
    }

    /// <summary>Stratum 1 for a sample whose event was seen, 0 for a censored one.</summary>
    public static ResamplingStrata Of(FollowUpOutcome outcome)
    {
        ArgumentNullException.ThrowIfNull(outcome);
        var events = outcome.Events;
        var strata = new int[events.Length];
        for (int s = 0; s < strata.Length; s++) strata[s] = events[s] ? 1 : 0;
        return new ResamplingStrata(strata, 2);
    }
}
