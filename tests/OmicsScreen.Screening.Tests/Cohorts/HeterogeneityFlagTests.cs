using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Cohorts;

public sealed class HeterogeneityFlagTests
{
    [Fact]
    public void Cochrans_q_p_values_are_adjusted_across_markers_as_statsmodels_does()
    {
        // Source: stats_reference.json "heterogeneity_bh": Cochran's Q p-value from statsmodels'
        // combine_effects and scipy's chi-square tail, q-values from statsmodels multipletests fdr_bh.
        var markers = new List<MarkerHeterogeneity>();
        var expected = new List<double>();
        int index = 0;
        foreach (var item in StatsReference.Block("heterogeneity_bh"))
        {
            var aucs = item.Doubles("aucs");
            var variances = item.Doubles("variances");
            var meta = RandomEffectsMetaAnalysis.DerSimonianLaird(aucs, variances);
            Assert.Equal(item.Number("q_p"), meta.QPValue, 1e-9);
            var effects = aucs.Select((auc, c) => new CohortEffect($"c{c}", 50, 0, auc, Math.Sqrt(variances[c]), ConfidenceInterval.Undefined(0.95))).ToList();
            markers.Add(new MarkerHeterogeneity(index, $"M{index}", effects, meta, 0.7, ConfidenceInterval.Undefined(0.95), 0.5, "c0", 1, CohortFlag.None));
            expected.Add(item.Number("bh_q"));
            index++;
        }
        var flagged = markers.ToArray();
        HeterogeneityFlags.Flag(flagged, 0.1);
        for (int i = 0; i < flagged.Length; i++)
        {
            Assert.Equal(expected[i], flagged[i].HeterogeneityQValue, 1e-9);
            double spread = flagged[i].Effects.Max(e => e.Effect) - flagged[i].Effects.Min(e => e.Effect);
            // Flagged only with q <= 0.1 and within-cohort AUCs at least 0.10 apart (common practice: a test and an effect size).
            Assert.Equal(expected[i] <= 0.1 && spread >= 0.10, flagged[i].Flag == CohortFlag.Heterogeneous);
        }
        Assert.Contains(flagged, m => m.Flag == CohortFlag.Heterogeneous);
        Assert.Contains(flagged, m => m.Flag == CohortFlag.None);
    }

    [Fact]
    public void An_artefact_flag_is_kept_whatever_the_heterogeneity()
    {
        var effects = new List<CohortEffect> { new("a", 50, 0, 0.3, 0.02, ConfidenceInterval.Undefined(0.95)), new("b", 50, 0, 0.9, 0.02, ConfidenceInterval.Undefined(0.95)) };
        var meta = RandomEffectsMetaAnalysis.DerSimonianLaird([0.3, 0.9], [0.0004, 0.0004]);
        var markers = new[] { new MarkerHeterogeneity(0, "M0", effects, meta, 0.7, ConfidenceInterval.Undefined(0.95), 0.9, "a", 1, CohortFlag.CohortArtefact) };
        HeterogeneityFlags.Flag(markers, 0.1);
        Assert.Equal(CohortFlag.CohortArtefact, markers[0].Flag);
    }

    [Fact]
    public void Heterogeneity_needs_the_measures_own_spread()
    {
        // Rho 0.35 and 0.62 are 0.27 apart: under the 0.30 a measured marker needs, so not flagged
        // whatever Cochran's Q says; 0.35 and 0.70 are (common practice: a test and an effect size).
        foreach (var (high, flagged) in new[] { (0.62, false), (0.70, true) })
        {
            var effects = new List<CohortEffect>
            {
                new("a", 400, double.NaN, 0.35, 0.05, ConfidenceInterval.Undefined(0.95)),
                new("b", 400, double.NaN, high, 0.05, ConfidenceInterval.Undefined(0.95)),
            };
            var meta = RandomEffectsMetaAnalysis.DerSimonianLaird([Math.Atanh(0.35), Math.Atanh(high)], [0.0025, 0.0025]);
            Assert.True(meta.QPValue < 0.001);
            var markers = new[] { new MarkerHeterogeneity(0, "M", effects, meta, 0.5, ConfidenceInterval.Undefined(0.95), 0.5, "a", 1, CohortFlag.None)
                { Measure = CohortEffectMeasure.SpearmanRho } };
            HeterogeneityFlags.Flag(markers, 0.1);
            Assert.Equal(flagged, markers[0].Flag == CohortFlag.Heterogeneous);
        }
    }
}
