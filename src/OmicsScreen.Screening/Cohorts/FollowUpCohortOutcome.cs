using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Censored follow-up: the Cox hazard ratio per panel-wide SD in each cohort, pooled on the log
/// scale (<see cref="CohortOutcomePooling.LogHazardRatio"/>), the hazard ratio per SD over all
/// samples from the single-marker table, eta of the martingale residuals on cohort with the
/// k-sample log-rank test, and held-out cohorts scored by Harrell's C with its interval.
/// </summary>
internal sealed class FollowUpCohortOutcome(Panel panel, FollowUpMarker[] markers) : CohortOutcome(panel)
{
    private readonly double[] _times = panel.FollowUp!.Times.ToArray();
    private readonly bool[] _events = panel.FollowUp!.Events.ToArray();

    public override CohortEffectMeasure Measure => CohortEffectMeasure.HazardRatioPerSd;

    public override (double Strength, double PValue) Association() => OutcomeCohortAssociation.OfFollowUp(_times, _events, Cohort);

    public override MarkerHeterogeneity Marker(int feature, int cohortImportanceRank, int[][] rowsOf)
    {
        var pooling = CohortOutcomePooling.LogHazardRatio(Panel.Matrix, feature, _times, _events, Cohort);
        return FromPooling(feature, pooling, markers[feature].HazardRatioPerSd, markers[feature].HazardRatioInterval, cohortImportanceRank, rowsOf);
    }

    /// <summary>Harrell's C of the forest's mortality on the held-out cohort, with its infinitesimal-jackknife interval; the error is 1 - C.</summary>
    public override HeldOutCohort HeldOut(string cohortName, int panelSize, PanelScore scored, int[] testRows)
    {
        var t = new double[testRows.Length];
        var e = new bool[testRows.Length];
        for (int i = 0; i < testRows.Length; i++)
        {
            t[i] = _times[testRows[i]];
            e[i] = _events[testRows[i]];
        }
        var estimate = HarrellConcordance.Estimate(t, e, scored.Predictions);
        var interval = estimate.ComparablePairs == 0 ? ConfidenceInterval.Undefined(0.95) : estimate.Interval;
        return new HeldOutCohort(cohortName, testRows.Length, panelSize, scored.Score, interval, scored.Error);
    }
}
