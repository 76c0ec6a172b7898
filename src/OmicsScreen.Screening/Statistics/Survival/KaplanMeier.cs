namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>Product-limit estimates of a survival curve (Kaplan & Meier 1958).</summary>
public static class KaplanMeier
{
    /// <summary>
    /// The curve of the samples' follow-up. A sample censored at an event time counts as at risk
    /// at that time (common practice: censoring is taken to happen just after events at the same time).
    /// </summary>
    public static SurvivalCurve Estimate(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved)
    {
        FollowUp.Check(time, eventObserved);
        var order = FollowUp.OrderByTime(time);
        var times = new List<double>();
        var atRisk = new List<int>();
        var events = new List<int>();
        var survival = new List<double>();
        var error = new List<double>();
        var hazard = new List<double>();
        double s = 1.0, greenwoodSum = 0.0, cumulativeHazard = 0.0;
        int remaining = order.Length, start = 0;
        while (start < order.Length)
        {
            double t = time[order[start]];
            int end = start, deaths = 0;
            while (end < order.Length && time[order[end]] == t)
            {
                if (eventObserved[order[end]]) deaths++;
                end++;
            }
            if (deaths > 0)
            {
                s *= 1.0 - (double)deaths / remaining;
                // Greenwood (1926): Var S = S^2 sum d / (n (n - d)); infinite once the curve reaches 0.
                greenwoodSum += remaining > deaths ? (double)deaths / ((double)remaining * (remaining - deaths)) : double.PositiveInfinity;
                cumulativeHazard += (double)deaths / remaining;
                times.Add(t);
                atRisk.Add(remaining);
                events.Add(deaths);
                survival.Add(s);
                error.Add(s > 0 ? s * Math.Sqrt(greenwoodSum) : double.NaN);
                hazard.Add(cumulativeHazard);
            }
            remaining -= end - start;
            start = end;
        }
        return new SurvivalCurve(times.ToArray(), atRisk.ToArray(), events.ToArray(), survival.ToArray(), error.ToArray(), hazard.ToArray());
    }

    /// <summary>
    /// Median follow-up by the reverse Kaplan-Meier method (Schemper & Smith 1996): the curve of
    /// time to censoring, with events taken as censored. Unlike the median of observed times, it is
    /// not shortened by early events.
    /// </summary>
    public static double MedianFollowUp(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved)
    {
        var censored = new bool[eventObserved.Length];
        for (int i = 0; i < censored.Length; i++) censored[i] = !eventObserved[i];
        return Estimate(time, censored).Median;
    }
}
