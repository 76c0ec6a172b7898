using OmicsScreen.Reporting.Charts;
using OmicsScreen.Screening.Cohorts;

namespace OmicsScreen.Reporting.Screen;

/// <summary>The figures of the report's cohort section: per-cohort AUC forest plots and the map of cohort-screen agreement.</summary>
internal static class CohortReportCharts
{
    /// <summary>Forest plots are drawn for at most this many of the top shortlisted markers.</summary>
    public const int ForestPlotMarkerLimit = 6;

    /// <summary>A map of pairwise agreement says more than the table only from three screened cohorts.</summary>
    public const int HeatMapMinimumCohorts = 3;

    public const string CohortAxisLabel = "Cohort";
    public const string AucAxisLabel = "AUC, positive class against the rest (95% CI)";
    public const string PooledLabel = "Pooled (random effects)";
    public const string ConcordanceColourLabel = "Spearman correlation of importance";

    /// <summary>Short, because a map of three cohorts is narrow and a longer title would be cut.</summary>
    public const string ConcordanceTitle = "Agreement of cohort screens";

    /// <summary>
    /// One row per cohort with its Mann-Whitney AUC and DeLong interval, and the DerSimonian-Laird
    /// pooled within-cohort AUC as the diamond. A square's weight is the cohort's random-effects
    /// weight 1 / (v_i + tau²) (DerSimonian &amp; Laird 1986), so squares show each cohort's share of the pooled estimate.
    /// </summary>
    public static SvgImage CohortAuc(MarkerHeterogeneity marker)
    {
        double tau2 = marker.WithinCohort is { Tau2: var t } && double.IsFinite(t) ? t : 0;
        var rows = new ForestRow[marker.Effects.Count];
        for (int i = 0; i < rows.Length; i++)
        {
            var effect = marker.Effects[i];
            double variance = effect.StandardError * effect.StandardError;
            double weight = double.IsFinite(effect.Effect) && variance > 0 ? 1 / (variance + tau2) : double.NaN;
            rows[i] = new ForestRow(effect.Cohort, effect.Effect, effect.Interval.Lower, effect.Interval.Upper, weight);
        }
        var pooled = marker.WithinCohort is not null
            ? new ForestRow(PooledLabel, marker.WithinCohortEffect, marker.WithinCohortInterval.Lower, marker.WithinCohortInterval.Upper)
            : null;
        var measure = marker.Measure;
        string axis = measure == CohortEffectMeasure.Auc ? AucAxisLabel : CohortMeasureWords.Long(measure) + " (95% CI)";
        return ForestPlotChart.Render(new ForestPlotOptions(CohortMeasureWords.Short(measure) + " of " + marker.Feature + " in each cohort", axis, CohortAxisLabel,
            NullValue: measure.NullValue(), Decimals: 2), rows, pooled);
    }

    /// <summary>Pairwise Spearman correlation of the screened cohorts' mean importances; 1 on the diagonal.</summary>
    public static SvgImage Concordance(CohortResult cohorts)
    {
        var names = cohorts.ScreenedCohorts;
        int count = names.Count;
        var index = new Dictionary<string, int>(count, StringComparer.Ordinal);
        for (int i = 0; i < count; i++) index[names[i]] = i;
        var values = new double[count, count];
        for (int i = 0; i < count; i++)
            for (int j = 0; j < count; j++) values[i, j] = i == j ? 1 : double.NaN;
        foreach (var pair in cohorts.Concordance)
        {
            if (!index.TryGetValue(pair.First, out int a) || !index.TryGetValue(pair.Second, out int b)) continue;
            values[a, b] = pair.Spearman;
            values[b, a] = pair.Spearman;
        }
        return HeatMapChart.Render(new HeatMapOptions(ConcordanceTitle, ConcordanceColourLabel,
            CohortAxisLabel, CohortAxisLabel), names, names, values);
    }
}
