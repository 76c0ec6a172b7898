using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;

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

    /// <summary>The positive class against the rest, cohort by cohort, from the per-cohort rank tests.</summary>
    public static MarkerHeterogeneity OfClasses(Panel panel, UnivariateTable univariate, int feature, int contrast, int cohortRank)
    {
        var cohort = panel.Cohort!;
        int perCohort = panel.FeatureCount * univariate.Contrasts.Count;
        var effects = new List<CohortEffect>();
        var estimates = new List<double>();
        var variances = new List<double>();
        for (int c = 0; c < cohort.LevelCount; c++)
        {
            var row = univariate.PerCohort[c * perCohort + feature * univariate.Contrasts.Count + contrast];
            effects.Add(new CohortEffect(cohort.LevelNames[c], row.ClassSampleCount + row.RestSampleCount, row.Log2MedianRatio,
                row.Auc, row.AucStandardError, row.AucInterval));
            if (double.IsFinite(row.Auc) && row.AucStandardError > 0)
            {
                estimates.Add(row.Auc);
                variances.Add(row.AucStandardError * row.AucStandardError);
            }
        }
        var within = estimates.Count >= 2 ? RandomEffectsMetaAnalysis.DerSimonianLaird(estimates.ToArray(), variances.ToArray()) : null;
        var pooled = univariate.Row(feature, contrast);
        var (separation, separated) = CohortSeparation(panel.Matrix, feature, cohort);

        // An artefact: the pooled samples show an effect, the cohorts differ strongly, and within
        // cohorts there is no consistent effect (the pooled within-cohort interval spans 0.5).
        bool pooledEffect = !(pooled.AucInterval.Lower <= 0.5 && pooled.AucInterval.Upper >= 0.5);
        bool noWithinEffect = within is not null && within.RandomInterval.Lower <= 0.5 && within.RandomInterval.Upper >= 0.5;
        var flag = pooledEffect && noWithinEffect && separation >= StrongCohortSeparation ? CohortFlag.CohortArtefact : CohortFlag.None;
        return new MarkerHeterogeneity(feature, panel.Matrix.FeatureNames[feature], effects, within, pooled.Auc, pooled.AucInterval,
            separation, separated, cohortRank, flag);
    }

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
