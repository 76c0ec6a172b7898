using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>The k-sample log-rank statistic, its degrees of freedom and its chi-square p-value.</summary>
public readonly record struct GroupLogRankResult(double ChiSquare, int DegreesOfFreedom, double PValue);

/// <summary>
/// The log-rank test of k groups' survival (Mantel 1966; Peto &amp; Peto 1972), as R's survdiff
/// computes it: at each event time every group's events against their hypergeometric expectation,
/// summed into O - E; the statistic is (O - E)' V^- (O - E) over all groups but the last, with V
/// the summed multivariate hypergeometric covariance, on k - 1 degrees of freedom (groups with
/// no samples left out).
/// </summary>
public static class LogRankTestOfGroups
{
    public static GroupLogRankResult Test(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved, ReadOnlySpan<int> group, int groupCount)
    {
        FollowUp.Check(time, eventObserved);
        if (group.Length != time.Length) throw new ArgumentException("Each sample needs a group.");
        // Renumber the groups that hold samples to 0..k-1.
        var used = new int[groupCount];
        Array.Fill(used, -1);
        int k = 0;
        foreach (int g in group) if (used[g] < 0) used[g] = k++;
        if (k < 2) return new GroupLogRankResult(double.NaN, 0, double.NaN);
        var atRiskOf = new double[k];
        foreach (int g in group) atRiskOf[used[g]]++;
        var observedMinusExpected = new double[k];
        var covariance = new double[k, k];
        var deathsOf = new double[k];
        var leavingOf = new double[k];
        var order = FollowUp.OrderByTime(time);
        double atRisk = order.Length;
        int start = 0;
        while (start < order.Length)
        {
            double t = time[order[start]];
            Array.Clear(deathsOf);
            Array.Clear(leavingOf);
            int end = start;
            double deaths = 0;
            while (end < order.Length && time[order[end]] == t)
            {
                int sample = order[end], g = used[group[sample]];
                if (eventObserved[sample])
                {
                    deaths++;
                    deathsOf[g]++;
                }
                leavingOf[g]++;
                end++;
            }
            if (deaths > 0)
            {
                // Hypergeometric covariance of the deaths' split over groups, given the risk sets.
                double factor = atRisk > 1 ? deaths * (atRisk - deaths) / (atRisk - 1) : 0;
                for (int g = 0; g < k; g++)
                {
                    double share = atRiskOf[g] / atRisk;
                    observedMinusExpected[g] += deathsOf[g] - deaths * share;
                    for (int h = 0; h < k; h++)
                        covariance[g, h] += factor * share * ((g == h ? 1 : 0) - atRiskOf[h] / atRisk);
                }
            }
            for (int g = 0; g < k; g++) atRiskOf[g] -= leavingOf[g];
            atRisk -= end - start;
            start = end;
        }
        int df = k - 1;
        var v = Matrix<double>.Build.Dense(df, df, (i, j) => covariance[i, j]);
        var u = Vector<double>.Build.Dense(df, i => observedMinusExpected[i]);
        if (!(v.Determinant() > 0)) return new GroupLogRankResult(double.NaN, df, double.NaN);
        double chiSquare = u.DotProduct(v.Solve(u));
        return new GroupLogRankResult(chiSquare, df, 1 - ChiSquared.CDF(df, chiSquare));
    }
}
