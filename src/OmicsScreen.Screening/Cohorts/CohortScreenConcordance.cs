using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One of the cohort check's analyses: every cohort large enough is screened on its own samples
/// (a work unit), and every pair of those screens is compared.
/// </summary>
internal static class CohortScreenConcordance
{
    /// <param name="screenable">Cohorts large enough for a screen of their own (<see cref="CohortMembership.ScreenableCohorts"/>).</param>
    /// <param name="cohortDone">Told after each cohort's screen.</param>
    public static List<CohortConcordance> Compare(ScreenContext context, ScreenWork work, int[] screenable, Action cohortDone)
    {
        var cohort = context.Panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");
        var cohortOrders = new Dictionary<int, int[]>();
        var cohortImportance = new Dictionary<int, double[]>();
        foreach (int c in screenable)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            var screen = work.CohortScreen(c);
            cohortOrders[c] = screen.Order;
            cohortImportance[c] = screen.MeanCorrected;
            cohortDone();
        }
        var concordance = new List<CohortConcordance>();
        for (int i = 0; i < screenable.Length; i++)
            for (int j = i + 1; j < screenable.Length; j++)
            {
                int a = screenable[i], b = screenable[j];
                concordance.Add(Concord(cohort.LevelNames[a], cohort.LevelNames[b], cohortImportance[a], cohortImportance[b],
                    cohortOrders[a], cohortOrders[b]));
            }
        return concordance;
    }

    /// <summary>Spearman correlation of importance, top-k overlaps and rank-biased overlap of two cohorts' screens.</summary>
    public static CohortConcordance Concord(string first, string second, double[] importanceA, double[] importanceB, int[] orderA, int[] orderB)
    {
        const int rboDepth = 100;
        double Overlap(int k)
        {
            k = Math.Min(k, orderA.Length);
            return RankBiasedOverlap.TopOverlap<int>(orderA.AsSpan(0, k), orderB.AsSpan(0, k), k);
        }
        int depth = Math.Min(rboDepth, orderA.Length);
        return new CohortConcordance(first, second, Correlation.Spearman(importanceA, importanceB), Overlap(10), Overlap(20), Overlap(50),
            RankBiasedOverlap.Extrapolated<int>(orderA.AsSpan(0, depth), orderB.AsSpan(0, depth), 0.9));
    }
}
