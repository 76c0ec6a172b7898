using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One of the cohort check's analyses: which markers' within-cohort effects differ between
/// cohorts more than chance allows, judged across all features at once.
/// </summary>
internal static class HeterogeneityFlags
{
    /// <summary>
    /// Smallest spread of within-cohort AUCs (largest minus smallest) a heterogeneity flag needs
    /// besides a significant Cochran's Q: with many samples a tiny difference is significant and
    /// of no consequence to a lab (common practice: a test and an effect size together).
    /// </summary>
    public const double MinimumAucSpread = 0.10;

    /// <summary>
    /// Flags a marker as heterogeneous when Cochran's Q test of its within-cohort AUCs survives
    /// Benjamini-Hochberg (1995) adjustment across all features at the screen's level, and its
    /// within-cohort AUCs spread by at least <see cref="MinimumAucSpread"/>. An
    /// artefact flag is kept as it is. Every marker gets its Q test's q-value.
    /// </summary>
    public static void Flag(MarkerHeterogeneity[] markers, double level)
    {
        var pValues = new double[markers.Length];
        for (int i = 0; i < markers.Length; i++)
        {
            double p = markers[i].WithinCohort?.QPValue ?? double.NaN;
            pValues[i] = double.IsNaN(p) ? 1 : p;
        }
        var qValues = BenjaminiHochberg.Adjust(pValues);
        for (int i = 0; i < markers.Length; i++)
        {
            var marker = markers[i];
            double low = double.PositiveInfinity, high = double.NegativeInfinity;
            foreach (var effect in marker.Effects)
                if (double.IsFinite(effect.Auc))
                {
                    low = Math.Min(low, effect.Auc);
                    high = Math.Max(high, effect.Auc);
                }
            bool heterogeneous = marker.WithinCohort is not null && qValues[i] <= level && high - low >= MinimumAucSpread;
            markers[i] = marker with
            {
                HeterogeneityQValue = marker.WithinCohort is null ? double.NaN : qValues[i],
                Flag = marker.Flag == CohortFlag.None && heterogeneous ? CohortFlag.Heterogeneous : marker.Flag,
            };
        }
    }
}
