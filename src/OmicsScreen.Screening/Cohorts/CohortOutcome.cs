using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// What the cohort check needs of its outcome kind, and nothing more: the measure of a marker's
/// effect within a cohort and over all samples, how strongly the outcome depends on the cohort,
/// and how a held-out cohort's panel score is read. The per-cohort screens, their concordance, the
/// forest predicting the cohort, the heterogeneity flags and the artefact rule work on these alone,
/// so they mean the same for classes, measured quantities and censored follow-up.
/// </summary>
internal abstract class CohortOutcome(Panel panel)
{
    protected Panel Panel { get; } = panel;

    protected SampleGrouping Cohort { get; } = panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");

    public static CohortOutcome For(ScreenContext context, SingleMarkerStatistics singleMarkers) => context.Panel.Kind switch
    {
        OutcomeKind.Measured => new MeasuredCohortOutcome(context.Panel, singleMarkers.Measured),
        OutcomeKind.TimeToEvent => new FollowUpCohortOutcome(context.Panel, singleMarkers.FollowUp),
        _ => new ClassCohortOutcome(context.Panel, singleMarkers.Classes),
    };

    public abstract CohortEffectMeasure Measure { get; }

    /// <summary>How much the outcome depends on the cohort (0 to 1, <see cref="OutcomeCohortAssociation"/>) and the test of no dependence.</summary>
    public abstract (double Strength, double PValue) Association();

    /// <summary>
    /// One feature across cohorts: its effect in every cohort (in level order), their pooling, its
    /// effect over all samples, its cohort separation and artefact flag.
    /// </summary>
    /// <param name="rowsOf">The samples of each cohort.</param>
    public abstract MarkerHeterogeneity Marker(int feature, int cohortImportanceRank, int[][] rowsOf);

    /// <summary>A held-out cohort's panel score, read in the kind's measure with its interval.</summary>
    public abstract HeldOutCohort HeldOut(string cohortName, int panelSize, PanelScore scored, int[] testRows);

    /// <summary>The 95% normal interval of a value on the pooled scale, read back on the effect's scale.</summary>
    protected ConfidenceInterval BackInterval(double pooledScaleValue, double standardError)
    {
        double critical = NormalTail.TwoSidedCritical(0.95);
        return new ConfidenceInterval(Measure.FromPooledScale(pooledScaleValue - critical * standardError),
            Measure.FromPooledScale(pooledScaleValue + critical * standardError), 0.95);
    }

    /// <summary>
    /// Every cohort's effect in level order from the per-cohort pooling of
    /// <see cref="CohortOutcomePooling"/>, with NaN for the cohorts it skipped, and its random-effects result.
    /// </summary>
    protected MarkerHeterogeneity FromPooling(int feature, PooledCohortEffect pooling, double allSamplesEffect,
        ConfidenceInterval allSamplesInterval, int cohortImportanceRank, int[][] rowsOf)
    {
        var effects = new List<CohortEffect>(Cohort.LevelCount);
        for (int c = 0; c < Cohort.LevelCount; c++)
        {
            string name = Cohort.LevelNames[c];
            CohortOutcomeEffect? found = null;
            foreach (var effect in pooling.Cohorts)
                if (effect.Cohort == name) { found = effect; break; }
            effects.Add(found is null
                ? new CohortEffect(name, rowsOf[c].Length, double.NaN, double.NaN, double.NaN, ConfidenceInterval.Undefined(0.95))
                : new CohortEffect(name, found.Samples, double.NaN, Measure.FromPooledScale(found.PooledScale), Math.Sqrt(found.Variance),
                    BackInterval(found.PooledScale, Math.Sqrt(found.Variance))));
        }
        return MarkerAcrossCohorts.Assemble(Panel, feature, Measure, effects, pooling.Pooled, allSamplesEffect, allSamplesInterval, cohortImportanceRank);
    }
}
