namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>The cumulative/dynamic AUC of a risk score at one horizon.</summary>
/// <param name="Horizon">The time t the AUC is for, in the follow-up's unit.</param>
/// <param name="Auc">Weighted share of (case, control) pairs in which the case scored higher (ties count one half).</param>
/// <param name="Cases">Samples with the event at or before the horizon.</param>
/// <param name="Controls">Samples followed beyond the horizon.</param>
/// <param name="CensoredBeforeHorizon">Samples censored at or before the horizon: neither case nor control, represented through the weights.</param>
public readonly record struct TimeDependentAucEstimate(double Horizon, double Auc, int Cases, int Controls, int CensoredBeforeHorizon);

/// <summary>
/// The time-dependent AUC of a risk score at a horizon t in its cumulative/dynamic form (Heagerty,
/// Lumley &amp; Pepe 2000): cases are the samples with the event by t (T_i &lt;= t, event
/// observed), controls those still event-free after t (T_j &gt; t). Samples censored by t are
/// neither; they are accounted for by inverse-probability-of-censoring weights (Uno et al. 2007;
/// Blanche, Dartigues &amp; Jacqmin-Gadda 2013, the "marginal" weighting), with G the Kaplan-Meier
/// estimate of the censoring times' survival:
/// <code>
/// AUC(t) = Σ_i Σ_j w_i w_j [1{M_i &gt; M_j} + ½ 1{M_i = M_j}] / (Σ_i w_i · Σ_j w_j),
/// w_i = 1 / G(T_i−) for a case, w_j = 1 / G(t) for a control.
/// </code>
/// Every control has the same weight, so it cancels; the case weights do not.
/// </summary>
public static class TimeDependentAuc
{
    /// <summary>
    /// Why the AUC cannot be computed at this horizon, as a sentence naming the figures; null when
    /// it can. It cannot when no sample is followed beyond the horizon (no controls: the horizon is
    /// at or beyond the last follow-up) or no event happened by it (no cases).
    /// </summary>
    public static string? HorizonProblem(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved, double horizon)
    {
        FollowUp.Check(time, eventObserved);
        if (time.Length == 0) return "the cohort has no samples";
        if (!double.IsFinite(horizon) || horizon <= 0)
            return FormattableString.Invariant($"the horizon {horizon} is not a positive number of the follow-up's time unit");
        double last = double.NegativeInfinity, firstEvent = double.PositiveInfinity;
        int cases = 0;
        for (int i = 0; i < time.Length; i++)
        {
            last = Math.Max(last, time[i]);
            if (!eventObserved[i]) continue;
            firstEvent = Math.Min(firstEvent, time[i]);
            if (time[i] <= horizon) cases++;
        }
        if (horizon >= last)
            return FormattableString.Invariant($"the horizon {horizon:G6} is at or beyond the last follow-up time ({last:G6}), so no sample is known to be event-free after it");
        if (cases == 0)
            return double.IsPositiveInfinity(firstEvent)
                ? "the cohort has no events, so no sample had the event by the horizon"
                : FormattableString.Invariant($"no event happened by the horizon {horizon:G6} (the first event is at {firstEvent:G6})");
        return null;
    }

    /// <param name="riskScore">Higher means the event is expected earlier.</param>
    /// <exception cref="ArgumentException">The horizon has no cases or no controls (<see cref="HorizonProblem"/> says which).</exception>
    public static TimeDependentAucEstimate CumulativeDynamic(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved,
        ReadOnlySpan<double> riskScore, double horizon)
    {
        if (riskScore.Length != time.Length) throw new ArgumentException("The score needs one value per sample.");
        if (HorizonProblem(time, eventObserved, horizon) is { } problem) throw new ArgumentException(problem);
        foreach (double r in riskScore)
            if (double.IsNaN(r)) throw new ArgumentException("The score has a missing value; drop those samples first.");
        int n = time.Length;
        var censoringSurvival = CensoringSurvivalBefore(time, eventObserved);

        var controls = new List<double>();
        int censoredBefore = 0;
        for (int i = 0; i < n; i++)
        {
            if (time[i] > horizon) controls.Add(riskScore[i]);
            else if (!eventObserved[i]) censoredBefore++;
        }
        var sortedControls = controls.ToArray();
        Array.Sort(sortedControls);

        double numerator = 0, caseWeight = 0;
        int cases = 0;
        for (int i = 0; i < n; i++)
        {
            if (!eventObserved[i] || time[i] > horizon) continue;
            cases++;
            double weight = 1.0 / censoringSurvival[i];
            int below = LowerBound(sortedControls, riskScore[i]);
            int equal = LowerBound(sortedControls, Math.BitIncrement(riskScore[i])) - below;
            numerator += weight * (below + 0.5 * equal);
            caseWeight += weight;
        }
        double auc = numerator / (caseWeight * sortedControls.Length);
        return new TimeDependentAucEstimate(horizon, auc, cases, sortedControls.Length, censoredBefore);
    }

    /// <summary>
    /// Per sample, G(T_i−): the Kaplan-Meier survival of the censoring times just before the
    /// sample's own time (censoring counted as the event, events as censored; at risk at u are the
    /// samples with T &gt;= u, as survfit(Surv(time, 1 - status)) counts them).
    /// </summary>
    private static double[] CensoringSurvivalBefore(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved)
    {
        var order = FollowUp.OrderByTime(time);
        var before = new double[time.Length];
        double g = 1.0;
        int remaining = order.Length, start = 0;
        while (start < order.Length)
        {
            double t = time[order[start]];
            int end = start, censored = 0;
            while (end < order.Length && time[order[end]] == t)
            {
                before[order[end]] = g;
                if (!eventObserved[order[end]]) censored++;
                end++;
            }
            if (censored > 0) g *= 1.0 - (double)censored / remaining;
            remaining -= end - start;
            start = end;
        }
        return before;
    }

    /// <summary>The number of sorted values strictly below <paramref name="value"/>.</summary>
    private static int LowerBound(double[] sorted, double value)
    {
        int low = 0, high = sorted.Length;
        while (low < high)
        {
            int middle = (low + high) >>> 1;
            if (sorted[middle] < value) low = middle + 1;
            else high = middle;
        }
        return low;
    }
}
