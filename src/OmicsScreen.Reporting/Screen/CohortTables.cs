using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Cohorts;

namespace OmicsScreen.Reporting.Screen;

/// <summary>The cohort check's tables: concordance of cohort screens, markers across cohorts, held-out cohorts.</summary>
public static class CohortTables
{
    private static readonly NumberFormat Four = NumberFormat.Fixed(4);

    public static int WriteConcordance(TextWriter writer, CohortResult cohorts) =>
        new TsvTableWriter<CohortConcordance>(
        [
            TsvColumn<CohortConcordance>.Text("cohort_a", c => c.First),
            TsvColumn<CohortConcordance>.Text("cohort_b", c => c.Second),
            TsvColumn<CohortConcordance>.Number("spearman", c => c.Spearman, Four),
            TsvColumn<CohortConcordance>.Number("top10_overlap", c => c.Top10Overlap, Four),
            TsvColumn<CohortConcordance>.Number("top20_overlap", c => c.Top20Overlap, Four),
            TsvColumn<CohortConcordance>.Number("top50_overlap", c => c.Top50Overlap, Four),
            TsvColumn<CohortConcordance>.Number("rank_biased_overlap", c => c.RankBiasedOverlap, Four),
        ]).Write(writer, cohorts.Concordance);

    /// <summary>
    /// The effect's name in column names: <c>auc</c> (classes), <c>rho</c> (Spearman's, measured)
    /// or <c>hazard_ratio_per_sd</c> (follow-up).
    /// </summary>
    public static string EffectColumn(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "rho",
        CohortEffectMeasure.HazardRatioPerSd => "hazard_ratio_per_sd",
        _ => "auc",
    };

    public static int WriteMarkers(TextWriter writer, CohortResult cohorts)
    {
        string effect = EffectColumn(cohorts.Measure);
        return new TsvTableWriter<MarkerHeterogeneity>(
        [
            TsvColumn<MarkerHeterogeneity>.Text("feature", m => m.Feature),
            TsvColumn<MarkerHeterogeneity>.Text("cohort_flag", m => FlagText(m.Flag)),
            TsvColumn<MarkerHeterogeneity>.Number("pooled_" + effect, m => m.AllSamplesEffect, Four),
            TsvColumn<MarkerHeterogeneity>.Number("pooled_" + effect + "_low95", m => m.AllSamplesInterval.Lower, Four),
            TsvColumn<MarkerHeterogeneity>.Number("pooled_" + effect + "_high95", m => m.AllSamplesInterval.Upper, Four),
            TsvColumn<MarkerHeterogeneity>.Number("within_cohort_" + effect, m => m.WithinCohortEffect, Four),
            TsvColumn<MarkerHeterogeneity>.Number("within_cohort_" + effect + "_low95", m => m.WithinCohortInterval.Lower, Four),
            TsvColumn<MarkerHeterogeneity>.Number("within_cohort_" + effect + "_high95", m => m.WithinCohortInterval.Upper, Four),
            TsvColumn<MarkerHeterogeneity>.Number("i2", m => m.WithinCohort?.I2 ?? double.NaN, Four),
            TsvColumn<MarkerHeterogeneity>.Number("tau2", m => m.WithinCohort?.Tau2 ?? double.NaN, NumberFormat.Significant(4)),
            TsvColumn<MarkerHeterogeneity>.Number("heterogeneity_p", m => m.WithinCohort?.QPValue ?? double.NaN, NumberFormat.Significant(4)),
            TsvColumn<MarkerHeterogeneity>.Number("heterogeneity_q", m => m.HeterogeneityQValue, NumberFormat.Significant(4)),
            TsvColumn<MarkerHeterogeneity>.Number("cohort_separation_auc", m => m.CohortSeparation, Four),
            TsvColumn<MarkerHeterogeneity>.Text("most_separated_cohort", m => m.SeparatedCohort),
            TsvColumn<MarkerHeterogeneity>.Integer("cohort_importance_rank", m => m.CohortImportanceRank),
        ]).Write(writer, cohorts.Markers);
    }

    /// <summary>Each feature in each cohort; the median ratio only for classes, where it is defined.</summary>
    public static int WriteEffects(TextWriter writer, CohortResult cohorts)
    {
        string effect = EffectColumn(cohorts.Measure);
        var columns = new List<TsvColumn<(string Feature, CohortEffect Effect)>>
        {
            TsvColumn<(string Feature, CohortEffect Effect)>.Text("feature", e => e.Feature),
            TsvColumn<(string Feature, CohortEffect Effect)>.Text("cohort", e => e.Effect.Cohort),
            TsvColumn<(string Feature, CohortEffect Effect)>.Integer("samples", e => e.Effect.SampleCount),
        };
        if (cohorts.Measure == CohortEffectMeasure.Auc)
            columns.Add(TsvColumn<(string Feature, CohortEffect Effect)>.Number("log2_median_ratio", e => e.Effect.Log2MedianRatio, NumberFormat.Fixed(3)));
        columns.Add(TsvColumn<(string Feature, CohortEffect Effect)>.Number(effect, e => e.Effect.Effect, Four));
        columns.Add(TsvColumn<(string Feature, CohortEffect Effect)>.Number(effect + "_low95", e => e.Effect.Interval.Lower, Four));
        columns.Add(TsvColumn<(string Feature, CohortEffect Effect)>.Number(effect + "_high95", e => e.Effect.Interval.Upper, Four));
        return new TsvTableWriter<(string Feature, CohortEffect Effect)>(columns)
            .Write(writer, cohorts.Markers.SelectMany(m => m.Effects.Select(e => (m.Feature, e))));
    }

    /// <summary>
    /// Each held-out cohort's score in the outcome kind's measure: AUC with its interval and the
    /// error (classes), R² and the mean squared error (measured), Harrell's C with its interval (follow-up).
    /// </summary>
    public static int WriteHeldOut(TextWriter writer, CohortResult cohorts)
    {
        var columns = new List<TsvColumn<HeldOutCohort>>
        {
            TsvColumn<HeldOutCohort>.Text("held_out_cohort", h => h.Cohort),
            TsvColumn<HeldOutCohort>.Integer("samples", h => h.SampleCount),
            TsvColumn<HeldOutCohort>.Integer("panel_size", h => h.PanelSize),
        };
        switch (cohorts.Measure)
        {
            case CohortEffectMeasure.SpearmanRho:
                columns.Add(TsvColumn<HeldOutCohort>.Number("r_squared", h => h.Score, Four));
                columns.Add(TsvColumn<HeldOutCohort>.Number("mean_squared_error", h => h.Error, NumberFormat.Significant(4)));
                break;
            case CohortEffectMeasure.HazardRatioPerSd:
                columns.Add(TsvColumn<HeldOutCohort>.Number("concordance", h => h.Score, Four));
                columns.Add(TsvColumn<HeldOutCohort>.Number("concordance_low95", h => h.ScoreInterval.Lower, Four));
                columns.Add(TsvColumn<HeldOutCohort>.Number("concordance_high95", h => h.ScoreInterval.Upper, Four));
                break;
            default:
                columns.Add(TsvColumn<HeldOutCohort>.Number("auc", h => h.Score, Four));
                columns.Add(TsvColumn<HeldOutCohort>.Number("auc_low95", h => h.ScoreInterval.Lower, Four));
                columns.Add(TsvColumn<HeldOutCohort>.Number("auc_high95", h => h.ScoreInterval.Upper, Four));
                columns.Add(TsvColumn<HeldOutCohort>.Number("error", h => h.Error, Four));
                break;
        }
        return new TsvTableWriter<HeldOutCohort>(columns).Write(writer, cohorts.HeldOut);
    }

    public static string FlagText(CohortFlag flag) => flag switch
    {
        CohortFlag.CohortArtefact => "cohort_artefact",
        CohortFlag.Heterogeneous => "heterogeneous",
        _ => "",
    };
}
