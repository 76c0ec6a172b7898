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

    public static int WriteMarkers(TextWriter writer, CohortResult cohorts) =>
        new TsvTableWriter<MarkerHeterogeneity>(
        [
            TsvColumn<MarkerHeterogeneity>.Text("feature", m => m.Feature),
            TsvColumn<MarkerHeterogeneity>.Text("cohort_flag", m => FlagText(m.Flag)),
            TsvColumn<MarkerHeterogeneity>.Number("pooled_auc", m => m.PooledAuc, Four),
            TsvColumn<MarkerHeterogeneity>.Number("pooled_auc_low95", m => m.PooledAucInterval.Lower, Four),
            TsvColumn<MarkerHeterogeneity>.Number("pooled_auc_high95", m => m.PooledAucInterval.Upper, Four),
            TsvColumn<MarkerHeterogeneity>.Number("within_cohort_auc", m => m.WithinCohort?.RandomEstimate ?? double.NaN, Four),
            TsvColumn<MarkerHeterogeneity>.Number("within_cohort_auc_low95", m => m.WithinCohort?.RandomInterval.Lower ?? double.NaN, Four),
            TsvColumn<MarkerHeterogeneity>.Number("within_cohort_auc_high95", m => m.WithinCohort?.RandomInterval.Upper ?? double.NaN, Four),
            TsvColumn<MarkerHeterogeneity>.Number("i2", m => m.WithinCohort?.I2 ?? double.NaN, Four),
            TsvColumn<MarkerHeterogeneity>.Number("tau2", m => m.WithinCohort?.Tau2 ?? double.NaN, NumberFormat.Significant(4)),
            TsvColumn<MarkerHeterogeneity>.Number("heterogeneity_p", m => m.WithinCohort?.QPValue ?? double.NaN, NumberFormat.Significant(4)),
            TsvColumn<MarkerHeterogeneity>.Number("heterogeneity_q", m => m.HeterogeneityQValue, NumberFormat.Significant(4)),
            TsvColumn<MarkerHeterogeneity>.Number("cohort_separation_auc", m => m.CohortSeparation, Four),
            TsvColumn<MarkerHeterogeneity>.Text("most_separated_cohort", m => m.SeparatedCohort),
            TsvColumn<MarkerHeterogeneity>.Integer("cohort_importance_rank", m => m.CohortImportanceRank),
        ]).Write(writer, cohorts.Markers);

    public static int WriteEffects(TextWriter writer, CohortResult cohorts) =>
        new TsvTableWriter<(string Feature, CohortEffect Effect)>(
        [
            TsvColumn<(string Feature, CohortEffect Effect)>.Text("feature", e => e.Feature),
            TsvColumn<(string Feature, CohortEffect Effect)>.Text("cohort", e => e.Effect.Cohort),
            TsvColumn<(string Feature, CohortEffect Effect)>.Integer("samples", e => e.Effect.SampleCount),
            TsvColumn<(string Feature, CohortEffect Effect)>.Number("log2_median_ratio", e => e.Effect.Log2MedianRatio, NumberFormat.Fixed(3)),
            TsvColumn<(string Feature, CohortEffect Effect)>.Number("auc", e => e.Effect.Auc, Four),
            TsvColumn<(string Feature, CohortEffect Effect)>.Number("auc_low95", e => e.Effect.AucInterval.Lower, Four),
            TsvColumn<(string Feature, CohortEffect Effect)>.Number("auc_high95", e => e.Effect.AucInterval.Upper, Four),
        ]).Write(writer, cohorts.Markers.SelectMany(m => m.Effects.Select(e => (m.Feature, e))));

    public static int WriteHeldOut(TextWriter writer, CohortResult cohorts) =>
        new TsvTableWriter<HeldOutCohort>(
        [
            TsvColumn<HeldOutCohort>.Text("held_out_cohort", h => h.Cohort),
            TsvColumn<HeldOutCohort>.Integer("samples", h => h.SampleCount),
            TsvColumn<HeldOutCohort>.Integer("panel_size", h => h.PanelSize),
            TsvColumn<HeldOutCohort>.Number("auc", h => h.Auc, Four),
            TsvColumn<HeldOutCohort>.Number("auc_low95", h => h.AucInterval.Lower, Four),
            TsvColumn<HeldOutCohort>.Number("auc_high95", h => h.AucInterval.Upper, Four),
            TsvColumn<HeldOutCohort>.Number("error", h => h.Error, Four),
        ]).Write(writer, cohorts.HeldOut);

    public static string FlagText(CohortFlag flag) => flag switch
    {
        CohortFlag.CohortArtefact => "cohort_artefact",
        CohortFlag.Heterogeneous => "heterogeneous",
        _ => "",
    };
}
