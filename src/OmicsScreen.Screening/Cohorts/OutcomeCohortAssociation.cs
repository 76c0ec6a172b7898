using MathNet.Numerics.Distributions;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One of the cohort check's analyses: how strongly the outcome depends on the cohort. When it
/// depends strongly, no method can tell a marker of outcome from a marker of cohort.
/// </summary>
/// <remarks>
/// One strength on the same 0-to-1 scale for every kind: Cramér's V for classes, and for the other
/// kinds the correlation ratio eta = sqrt(between-cohort sum of squares / total sum of squares) of
/// a score of the outcome (Pearson 1903): the outcome's ranks, or the martingale residuals of the
/// follow-up under no covariate (event indicator minus its Nelson-Aalen cumulative hazard;
/// Therneau, Grambsch &amp; Fleming 1990). With two classes V is exactly eta of the class indicator,
/// so the confounding threshold of 0.5 means the same for every kind.
/// </remarks>
internal static class OutcomeCohortAssociation
{
    /// <summary>An association at or above this strength means outcome and cohort cannot be separated.</summary>
    public const double ConfoundingStrength = 0.5;

    /// <summary>Cramer's V of the class x cohort table (Cramer 1946) with the chi-square test of independence.</summary>
    public static (double CramersV, double PValue) OfClasses(ClassOutcome outcome, SampleGrouping cohort)
    {
        int rows = outcome.ClassCount, columns = cohort.LevelCount, n = outcome.SampleCount;
        var table = new double[rows, columns];
        for (int s = 0; s < n; s++) table[outcome.SampleClasses[s], cohort.SampleLevels[s]]++;
        var rowSums = new double[rows];
        var columnSums = new double[columns];
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < columns; c++)
            {
                rowSums[r] += table[r, c];
                columnSums[c] += table[r, c];
            }
        double chiSquare = 0;
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < columns; c++)
            {
                double expected = rowSums[r] * columnSums[c] / n;
                if (expected > 0) chiSquare += (table[r, c] - expected) * (table[r, c] - expected) / expected;
            }
        int usedRows = rowSums.Count(x => x > 0), usedColumns = columnSums.Count(x => x > 0);
        int smaller = Math.Min(usedRows, usedColumns) - 1;
        if (smaller < 1) return (double.NaN, double.NaN);
        double v = Math.Sqrt(chiSquare / (n * smaller));
        int degrees = (usedRows - 1) * (usedColumns - 1);
        return (v, ChiSquared.CDF(degrees, chiSquare) is var cdf ? 1 - cdf : double.NaN);
    }

    /// <summary>
    /// Eta of the measured outcome's mid-ranks on cohort, with the Kruskal-Wallis (1952) test: its
    /// H statistic is (n - 1) eta^2 on the ranks, on (cohorts - 1) degrees of freedom. Samples
    /// without a value are left out.
    /// </summary>
    public static (double Eta, double PValue) OfMeasured(ReadOnlySpan<double> outcome, SampleGrouping cohort)
    {
        var kept = new List<int>(outcome.Length);
        for (int s = 0; s < outcome.Length; s++) if (!double.IsNaN(outcome[s])) kept.Add(s);
        var values = new double[kept.Count];
        var levels = new int[kept.Count];
        for (int i = 0; i < kept.Count; i++)
        {
            values[i] = outcome[kept[i]];
            levels[i] = cohort.SampleLevels[kept[i]];
        }
        var (eta2, groups) = CorrelationRatioSquared(Ranking.Rank(values), levels, cohort.LevelCount);
        if (double.IsNaN(eta2) || groups < 2) return (double.NaN, double.NaN);
        double h = (kept.Count - 1) * eta2;
        return (Math.Sqrt(eta2), 1 - ChiSquared.CDF(groups - 1, h));
    }

    /// <summary>Eta of the follow-up's martingale residuals on cohort, with the k-sample log-rank test of the cohorts' survival.</summary>
    public static (double Eta, double PValue) OfFollowUp(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved, SampleGrouping cohort)
    {
        var residuals = MartingaleResiduals(time, eventObserved);
        var (eta2, groups) = CorrelationRatioSquared(residuals, cohort.SampleLevels.ToArray(), cohort.LevelCount);
        if (double.IsNaN(eta2) || groups < 2) return (double.NaN, double.NaN);
        var test = LogRankTestOfGroups.Test(time, eventObserved, cohort.SampleLevels, cohort.LevelCount);
        return (Math.Sqrt(eta2), test.PValue);
    }

    /// <summary>Event indicator minus the Nelson-Aalen cumulative hazard at the sample's own time (its events included).</summary>
    internal static double[] MartingaleResiduals(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved)
    {
        int n = time.Length;
        var order = Enumerable.Range(0, n).ToArray();
        var t = time.ToArray();
        Array.Sort(order, (a, b) => t[a] != t[b] ? t[a].CompareTo(t[b]) : a.CompareTo(b));
        var residuals = new double[n];
        double cumulative = 0;
        int atRisk = n, start = 0;
        while (start < n)
        {
            int end = start, deaths = 0;
            while (end < n && t[order[end]] == t[order[start]])
            {
                if (eventObserved[order[end]]) deaths++;
                end++;
            }
            cumulative += (double)deaths / atRisk;
            for (int i = start; i < end; i++) residuals[order[i]] = (eventObserved[order[i]] ? 1 : 0) - cumulative;
            atRisk -= end - start;
            start = end;
        }
        return residuals;
    }

    /// <summary>Between-group over total sum of squares of a score, and how many groups hold samples; NaN when the score does not vary.</summary>
    private static (double Eta2, int Groups) CorrelationRatioSquared(double[] score, int[] levels, int levelCount)
    {
        double mean = 0;
        foreach (double v in score) mean += v;
        mean /= score.Length;
        var sums = new double[levelCount];
        var counts = new int[levelCount];
        double total = 0;
        for (int i = 0; i < score.Length; i++)
        {
            sums[levels[i]] += score[i];
            counts[levels[i]]++;
            total += (score[i] - mean) * (score[i] - mean);
        }
        double between = 0;
        int groups = 0;
        for (int g = 0; g < levelCount; g++)
        {
            if (counts[g] == 0) continue;
            groups++;
            double groupMean = sums[g] / counts[g];
            between += counts[g] * (groupMean - mean) * (groupMean - mean);
        }
        return total > 0 ? (Math.Min(1, between / total), groups) : (double.NaN, groups);
    }
}
