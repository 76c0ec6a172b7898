using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Cohorts;

public class CohortAnalysisTests
{
    private const int Artefact = 0, Consistent = 1, OneCohortOnly = 2;

    /// <summary>
    /// Three cohorts of 90 (case shares 25%, 25%, 60%, so cohort and outcome are associated),
    /// 150 noise features, and three planted ones: feature 0 shifted 2.5 SD in cohort 2 only (no
    /// class effect); feature 1 shifted 1.2 SD in cases of every cohort; feature 2 shifted 2 SD in
    /// cases of cohort 0 only.
    /// </summary>
    private static Panel ThreeCohortPanel(ulong seed) => CohortPanel.Generate(new CohortPanel.Design
    {
        FeatureCount = 153,
        Effects =
        [
            new CohortPanel.PlantedEffect(Artefact, 2.5, CasesOnly: false, OnlyCohort: 2),
            new CohortPanel.PlantedEffect(Consistent, 1.2, CasesOnly: true),
            new CohortPanel.PlantedEffect(OneCohortOnly, 2.0, CasesOnly: true, OnlyCohort: 0),
        ],
        Seed = seed,
    });

    private static ScreenResult Screen(Panel panel) => ScreenRunner.Run(panel, new ScreenOptions
    {
        Seed = 3, HalfSamplePairs = 5, TreesPerForest = 300, CurveFolds = 0, CurveInnerPairs = 3,
    });

    [Fact]
    public void A_marker_shifted_only_between_cohorts_is_flagged_and_consistent_markers_are_not()
    {
        var result = Screen(ThreeCohortPanel(11));
        var cohorts = result.Cohorts!;
        var artefact = cohorts.Marker(Artefact);
        Assert.NotNull(artefact);
        Assert.Equal(CohortFlag.CohortArtefact, artefact!.Flag);
        Assert.Equal("c2", artefact.SeparatedCohort);
        Assert.NotEqual(CohortFlag.CohortArtefact, cohorts.Marker(Consistent)!.Flag);
    }

    [Fact]
    public void A_consistent_effect_has_low_heterogeneity_and_a_one_cohort_effect_high()
    {
        var result = Screen(ThreeCohortPanel(12));
        var cohorts = result.Cohorts!;
        var consistent = cohorts.Marker(Consistent)!;
        var oneCohort = cohorts.Marker(OneCohortOnly)!;
        // I^2 (Higgins & Thompson 2002) of the per-cohort AUCs.
        Assert.True(consistent.WithinCohort!.I2 < 0.3, $"consistent I2 {consistent.WithinCohort.I2:0.00}");
        Assert.True(oneCohort.WithinCohort!.I2 > 0.75, $"one-cohort I2 {oneCohort.WithinCohort.I2:0.00}");
        Assert.Equal(CohortFlag.Heterogeneous, oneCohort.Flag);
        // The consistent marker leads every cohort's own screen, so their orders agree at the top.
        Assert.All(cohorts.Concordance, c => Assert.True(c.RankBiasedOverlap > 0, $"{c.First}-{c.Second}"));
    }

    [Fact]
    public void Held_out_cohorts_are_scored_and_the_outcome_cohort_association_is_measured()
    {
        var result = Screen(ThreeCohortPanel(13));
        var cohorts = result.Cohorts!;
        Assert.Equal(3, cohorts.HeldOut.Count);
        // The consistent marker carries over to every held-out cohort.
        Assert.All(cohorts.HeldOut, h => Assert.True(h.Score > 0.6, $"{h.Cohort}: AUC {h.Score:0.000}"));
        // Case shares 25/25/60%: a moderate association, not confounding.
        Assert.InRange(cohorts.OutcomeCohortAssociation, 0.2, 0.5);
        Assert.False(cohorts.Confounded);
        // Feature 0 makes cohort c2 recognisable, so cohort is predicted above the largest share.
        Assert.True(cohorts.CohortPredictionAccuracy > cohorts.LargestCohortShare);
    }

    [Fact]
    public void Cramers_v_of_a_table_worked_by_hand()
    {
        // 2 x 2 table [[30, 10], [10, 30]]: chi^2 = 80 * (30*30 - 10*10)^2 / (40^4) = 20, so
        // V = sqrt(20 / 80) = 0.5 (Cramer 1946, V = sqrt(chi^2 / (n (min(r, c) - 1)))).
        var classes = Enumerable.Repeat(0, 40).Concat(Enumerable.Repeat(1, 40)).ToArray();
        var levels = Enumerable.Repeat(0, 30).Concat(Enumerable.Repeat(1, 10)).Concat(Enumerable.Repeat(0, 10)).Concat(Enumerable.Repeat(1, 30)).ToArray();
        var (v, p) = OutcomeCohortAssociation.OfClasses(new ClassOutcome("y", ["a", "b"], classes), new SampleGrouping("c", ["x", "y"], levels));
        Assert.Equal(0.5, v, 12);
        // P(chi^2_1 >= 20) = 7.74e-6 (standard chi-square table value, from memory).
        Assert.InRange(p, 7.6e-6, 7.9e-6);
    }

    [Fact]
    public void With_exchangeable_cohorts_held_out_aucs_scatter_around_the_selection_aware_estimate()
    {
        // Cohort labels assigned at random: every cohort is a random third of one population, so a
        // panel chosen on two thirds should score on the last third as the selection-aware cross-validated
        // estimate predicts (common practice; the spread allowed is the held-out AUC's own DeLong
        // interval widened by the curve's fold SD).
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 240, FeatureCount = 300, Seed = 21 });
        var random = new Xoshiro256StarStar(99);
        var labels = Enumerable.Range(0, panel.SampleCount).Select(s => s % 3).ToArray();
        random.Shuffle(labels.AsSpan());
        var withCohorts = new Panel(panel.Matrix, panel.Outcome, new SampleGrouping("centre", ["a", "b", "c"], labels));
        var result = ScreenRunner.Run(withCohorts, new ScreenOptions
        {
            Seed = 5, HalfSamplePairs = 5, TreesPerForest = 300, CurveFolds = 5, CurveInnerPairs = 3, CurveMaxPanelSize = 21,
        });
        var curve = result.PanelSize!;
        var point = curve.Points.First(p => p.PanelSize == curve.RecommendedSize);
        var heldOut = result.Cohorts!.HeldOut;
        Assert.Equal(3, heldOut.Count);
        foreach (var h in heldOut)
        {
            double halfWidth = (h.ScoreInterval.Upper - h.ScoreInterval.Lower) / 2 + point.SelectionAwareAucSd;
            Assert.True(Math.Abs(h.Score - point.SelectionAwareAuc) <= halfWidth,
                $"{h.Cohort}: held-out AUC {h.Score:0.000} vs selection-aware {point.SelectionAwareAuc:0.000} (allowed {halfWidth:0.000})");
        }
        Assert.InRange(heldOut.Average(h => h.Score), point.SelectionAwareAuc - 0.08, point.SelectionAwareAuc + 0.08);
    }

    [Fact]
    public void Concordance_of_identical_screens_is_complete_and_of_reversed_ones_is_not()
    {
        var order = Enumerable.Range(0, 60).ToArray();
        var importance = order.Select(f => 60.0 - f).ToArray();
        var same = CohortScreenConcordance.Concord("a", "b", importance, importance, order, order);
        Assert.Equal(1.0, same.Top10Overlap);
        Assert.Equal(1.0, same.Top50Overlap);
        Assert.Equal(1.0, same.Spearman, 12);
        Assert.Equal(1.0, same.RankBiasedOverlap, 9);

        var reversed = order.Reverse().ToArray();
        var opposite = CohortScreenConcordance.Concord("a", "b", importance, importance.Reverse().ToArray(), order, reversed);
        // Top 10 of 0..59 and of 59..0 share nothing; their top 50 share 40 of 50 (items 10..49).
        Assert.Equal(0.0, opposite.Top10Overlap);
        Assert.Equal(0.8, opposite.Top50Overlap, 12);
        Assert.Equal(-1.0, opposite.Spearman, 12);
    }
}
