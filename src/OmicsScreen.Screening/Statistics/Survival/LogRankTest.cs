namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>The log-rank statistic and its chi-square p-value (1 degree of freedom).</summary>
public readonly record struct LogRankResult(double ChiSquare, double PValue, double ObservedInSecond, double ExpectedInSecond);

/// <summary>
/// The log-rank test of two groups' survival (Mantel 1966; Peto & Peto 1972): at each event time
/// the events in the second group against their hypergeometric expectation, summed, squared over the
/// summed hypergeometric variance.
/// </summary>
public static class LogRankTest
{
    public static LogRankResult TwoGroups(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved, ReadOnlySpan<bool> inSecondGroup)
    {
        FollowUp.Check(time, eventObserved);
        if (inSecondGroup.Length != time.Length) throw new ArgumentException("Each sample needs a group.");
        var order = FollowUp.OrderByTime(time);
        int atRisk = order.Length, atRiskSecond = 0;
        foreach (bool second in inSecondGroup) if (second) atRiskSecond++;
        double observed = 0, expected = 0, variance = 0;
        int start = 0;
        while (start < order.Length)
        {
            double t = time[order[start]];
            int end = start, deaths = 0, deathsSecond = 0, leavingSecond = 0;
            while (end < order.Length && time[order[end]] == t)
            {
                int sample = order[end];
                if (eventObserved[sample])
                {
                    deaths++;
                    if (inSecondGroup[sample]) deathsSecond++;
                }
                if (inSecondGroup[sample]) leavingSecond++;
                end++;
            }
            if (deaths > 0 && atRisk > 1)
            {
                double share = (double)atRiskSecond / atRisk;
                observed += deathsSecond;
                expected += deaths * share;
                variance += deaths * share * (1 - share) * (atRisk - deaths) / (atRisk - 1.0);
            }
            else if (deaths > 0)
            {
                observed += deathsSecond;
                expected += deaths * ((double)atRiskSecond / atRisk);
            }
            atRisk -= end - start;
            atRiskSecond -= leavingSecond;
            start = end;
        }
        if (!(variance > 0)) return new LogRankResult(double.NaN, double.NaN, observed, expected);
        double chiSquare = (observed - expected) * (observed - expected) / variance;
        return new LogRankResult(chiSquare, NormalTail.TwoSided(Math.Sqrt(chiSquare)), observed, expected);
    }
}
