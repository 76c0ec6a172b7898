using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One of the cohort check's analyses: which markers' within-cohort effects differ between
/// cohorts more than chance allows, judged across all features at once.
/// </summary>
internal static class HeterogeneityFlags
{
    /// <summary>
    /// Flags a marker as heterogeneous when Cochran's Q test of its within-cohort effects survives
    /// Benjamini-Hochberg (1995) adjustment across all features at the screen's level, and its
    /// within-cohort effects spread by at least the measure's minimum
    /// (<see cref="CohortEffectScale.MinimumSpread"/>: 0.10 of AUC, 0.30 of rho, 0.35 of log hazard
    /// ratio). An artefact flag is kept as it is. Every marker gets its Q test's q-value.
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
            double spread = marker.Measure.Spread(marker.Effects);
            bool heterogeneous = marker.WithinCohort is not null && qValues[i] <= level && spread >= marker.Measure.MinimumSpread();
            markers[i] = marker with
            {
                HeterogeneityQValue = marker.WithinCohort is null ? double.NaN : qValues[i],
                Flag = marker.Flag == CohortFlag.None && heterogeneous ? CohortFlag.Heterogeneous : marker.Flag,
            };
        }
    }
}
