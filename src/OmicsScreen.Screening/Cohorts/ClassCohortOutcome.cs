using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Classes: the positive class against the rest by Mann-Whitney AUC in each cohort (from the
/// per-cohort rank tests) and over all samples, Cramér's V of class and cohort, and held-out
/// cohorts scored by AUC with DeLong's interval.
/// </summary>
internal sealed class ClassCohortOutcome(Panel panel, UnivariateTable univariate) : CohortOutcome(panel)
{
    private readonly ClassOutcome _outcome = panel.Outcome;

    private readonly int _positiveContrast =
        Math.Max(0, univariate.Contrasts.ToList().IndexOf(panel.Outcome.ClassNames[panel.Outcome.PositiveClass]));

    public override CohortEffectMeasure Measure => CohortEffectMeasure.Auc;

    public override (double Strength, double PValue) Association() => OutcomeCohortAssociation.OfClasses(_outcome, Cohort);

    public override MarkerHeterogeneity Marker(int feature, int cohortImportanceRank, int[][] rowsOf)
    {
        int contrasts = univariate.Contrasts.Count;
        int perCohort = Panel.FeatureCount * contrasts;
        var effects = new List<CohortEffect>(Cohort.LevelCount);
        var estimates = new List<double>();
        var variances = new List<double>();
        for (int c = 0; c < Cohort.LevelCount; c++)
        {
            var row = univariate.PerCohort[c * perCohort + feature * contrasts + _positiveContrast];
            effects.Add(new CohortEffect(Cohort.LevelNames[c], row.ClassSampleCount + row.RestSampleCount, row.Log2MedianRatio,
                row.Auc, row.AucStandardError, row.AucInterval));
            if (double.IsFinite(row.Auc) && row.AucStandardError > 0)
            {
                estimates.Add(row.Auc);
                variances.Add(row.AucStandardError * row.AucStandardError);
            }
        }
        var pooled = univariate.Row(feature, _positiveContrast);
        return MarkerAcrossCohorts.Assemble(Panel, feature, Measure, effects, MarkerAcrossCohorts.Pool(estimates, variances),
            pooled.Auc, pooled.AucInterval, cohortImportanceRank);
    }

    /// <summary>The held-out cohort's AUC with its DeLong (1988) 95% interval (two classes, both present) and error.</summary>
    public override HeldOutCohort HeldOut(string cohortName, int panelSize, PanelScore scored, int[] testRows)
    {
        var positives = new List<double>();
        var negatives = new List<double>();
        for (int i = 0; i < testRows.Length; i++) (scored.IsPositive[i] ? positives : negatives).Add(scored.Predictions[i]);
        double auc = double.NaN;
        var interval = ConfidenceInterval.Undefined(0.95);
        if (_outcome.ClassCount == 2 && positives.Count > 0 && negatives.Count > 0)
        {
            var estimate = DeLong.Estimate(positives.ToArray(), negatives.ToArray());
            auc = estimate.Auc;
            interval = AucInterval.Compute(estimate.Auc, estimate.StandardError);
        }
        return new HeldOutCohort(cohortName, testRows.Length, panelSize, auc, interval, scored.Error);
    }
}
