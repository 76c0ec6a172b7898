using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One of the cohort check's analyses: a feature's effect within each cohort, their random-effects
/// pooling (DerSimonian &amp; Laird 1986), how well the feature separates the cohorts themselves, and
/// the cohort-artefact flag that follows. Heterogeneity is flagged afterwards, across all features
/// at once (<see cref="HeterogeneityFlags"/>).
/// </summary>
internal static class MarkerAcrossCohorts
{
    /// <summary>One-cohort-against-the-rest AUC from which a marker counts as separating cohorts.</summary>
    public const double StrongCohortSeparation = 0.75;

    /// <summary>
    /// A feature's per-cohort effects (every cohort, in level order; NaN where a cohort gives none),
    /// their pooling, the effect over all samples and its interval, put together with the
    /// feature's cohort separation and the artefact flag.
    /// </summary>
    /// <param name="within">The random-effects pooling of the usable cohorts on the measure's pooled scale; null with fewer than two.</param>
    public static MarkerHeterogeneity Assemble(Panel panel, int feature, CohortEffectMeasure measure, List<CohortEffect> effects,
        MetaAnalysisResult? within, double allSamplesEffect, ConfidenceInterval allSamplesInterval, int cohortRank)
    {
        var (separation, separated) = CohortSeparation(panel.Matrix, feature, panel.Cohort!);
        double none = measure.NullValue();
        // An artefact: the pooled samples show an effect, the cohorts differ strongly, and within
        // cohorts there is no consistent effect (the pooled within-cohort interval spans no effect).
        bool pooledEffect = !(allSamplesInterval.Lower <= none && allSamplesInterval.Upper >= none);
        var marker = new MarkerHeterogeneity(feature, panel.Matrix.FeatureNames[feature], effects, within, allSamplesEffect, allSamplesInterval,
            separation, separated, cohortRank, CohortFlag.None) { Measure = measure };
        var withinInterval = marker.WithinCohortInterval;
        bool noWithinEffect = within is not null && withinInterval.Lower <= none && withinInterval.Upper >= none;
        return pooledEffect && noWithinEffect && separation >= StrongCohortSeparation ? marker with { Flag = CohortFlag.CohortArtefact } : marker;
    }

    /// <summary>Pools the effects with a finite value and a positive standard error on the measure's scale; null with fewer than two.</summary>
    public static MetaAnalysisResult? Pool(IReadOnlyList<double> pooledScaleEstimates, IReadOnlyList<double> variances) =>
        pooledScaleEstimates.Count >= 2 ? RandomEffectsMetaAnalysis.DerSimonianLaird(pooledScaleEstimates.ToArray(), variances.ToArray()) : null;

    /// <summary>The cohort that the feature separates best from the others, by Mann-Whitney AUC folded to at least 0.5.</summary>
    public static (double Auc, string Cohort) CohortSeparation(FeatureMatrix matrix, int feature, SampleGrouping cohort)
    {
        var values = new List<double>[cohort.LevelCount];
        for (int c = 0; c < values.Length; c++) values[c] = [];
        var column = matrix.Column(feature);
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            var state = matrix.State(feature, s);
            if (state == CellState.Missing) continue;
            values[cohort.SampleLevels[s]].Add(state == CellState.BelowDetection ? double.NegativeInfinity : column[s]);
        }
        double best = 0.5;
        string bestCohort = cohort.LevelNames[0];
        for (int c = 0; c < values.Length; c++)
        {
            var rest = values.Where((_, i) => i != c).SelectMany(v => v).ToArray();
            if (values[c].Count == 0 || rest.Length == 0) continue;
            double auc = MannWhitney.Test(values[c].ToArray(), rest).Auc;
            double folded = Math.Max(auc, 1 - auc);
            if (folded > best)
            {
                best = folded;
                bestCohort = cohort.LevelNames[c];
            }
        }
        return (best, bestCohort);
    }
}
