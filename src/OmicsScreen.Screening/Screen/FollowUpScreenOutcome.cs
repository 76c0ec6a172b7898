using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Censored follow-up: random survival forests (log-rank splits, Ishwaran et al. 2008), the
/// out-of-bag drop in Harrell's C as permutation importance, the Cox score test on the marker's
/// ranks beside the forest, and held-out panels scored by Harrell's C of the forest's mortality.
/// </summary>
internal sealed class FollowUpScreenOutcome(FollowUpOutcome outcome) : ScreenOutcome
{
    private readonly FollowUpTimes _followUp = outcome.FollowUp;

    public override OutcomeKind Kind => OutcomeKind.TimeToEvent;

    /// <summary>
    /// A fold's panel is as long as the locked one, not capped at the fold's own list: the fit of
    /// many additive markers grows with their number (R² here, C for follow-up), and the inner
    /// screen, on 80% of the samples with 5 half-sample pairs, lists far fewer of them than the
    /// full screen (calibration: 2-5 against about 11 on the measured planted design), so capped
    /// folds estimated a shorter panel than the one locked (R² 0.17 against 0.27 on fresh samples).
    /// </summary>
    public override bool FoldPanelsTakeLockedLength => true;

    public override string ScoreName => "concordance";

    /// <summary>
    /// The Cox score test four times the forest's weight (0.8 and 0.2; the interaction scan is
    /// class-only). For a log-linear hazard the score test is the locally most powerful test, while
    /// a random survival forest's importance on 100-200 samples reads the same signal with more
    /// noise: on the calibration suite's planted follow-up design (seeds 1-10, 50 planted markers)
    /// the forest's p-value was the smaller for 7 of them. At even weights every marker the
    /// rank test carries paid a factor 2 before the decoys' tail bound, and follow-up screens
    /// found 7 of the 12 markers the Cox test alone finds on seeds 1-5; with these weights 10 of 12,
    /// the null panels' lists unchanged (README, "How well the error control holds"). A marker the
    /// forest alone carries now pays a factor 5 instead of 2; the decoys are combined with the same
    /// weights, so the p-values stay calibrated.
    /// </summary>
    public override CombinationWeights CombinationWeights { get; } = new(0.2, 0.8, 0);

    public override ResamplingStrata Strata { get; } = ResamplingStrata.Of(outcome);

    public override void GrowRepeat(BinnedMatrix matrix, int[] rows, ForestOptions options, ReadOnlySpan<int> decoySources,
        int threadCount, Span<double> impurity, Span<double> permutation, Span<double> corrected, Span<double> decoys)
    {
        var forest = SurvivalForestTrainer.Train(matrix, _followUp, options, rows);
        forest.MeanSplitStatistic().CopyTo(impurity);
        SurvivalImportance.MeasurePermutation(forest, matrix, threadCount).MeanRise.CopyTo(permutation);
        var air = SurvivalImportance.MeasureCorrected(matrix, _followUp, rows, decoySources, options);
        air.Features.CopyTo(corrected);
        air.Decoys.CopyTo(decoys);
    }

    /// <summary>Out-of-bag C of the reference forest; its error curve is 1 - C of the out-of-bag risk after each tree.</summary>
    public override ReferenceForest GrowReference(BinnedMatrix matrix, ForestOptions options)
    {
        var forest = SurvivalForestTrainer.Train(matrix, _followUp, options);
        var concordance = SurvivalImportance.OutOfBagConcordance(forest);
        var summary = new ReferenceForestSummary(1 - concordance.Concordance, [], null, ErrorCurve(forest))
        {
            OutOfBagConcordance = concordance.Concordance,
        };
        return new ReferenceForest(summary, null) { LeafValues = TreeLeafValues.OfSurvivalForest(forest) };
    }

    public override IReadOnlyList<TreeLeafValues> GrowLeafValues(BinnedMatrix matrix, ForestOptions options) =>
        TreeLeafValues.OfSurvivalForest(SurvivalForestTrainer.Train(matrix, _followUp, options));

    /// <summary>Events and censored samples apart, each in fifths of follow-up time by rank, so a copy keeps its marker's link to early or late events.</summary>
    public override int[] PartnerStrata()
    {
        var times = _followUp.Times.ToArray();
        var events = _followUp.Events.ToArray();
        var strata = new int[times.Length];
        for (int seen = 0; seen < 2; seen++)
        {
            var rows = Enumerable.Range(0, times.Length).Where(s => events[s] == (seen == 1)).ToArray();
            var bins = Effects.PartnerStrata.RankBins(rows.Select(s => times[s]).ToArray(), TimeStratumCount);
            for (int i = 0; i < rows.Length; i++) strata[rows[i]] = seen * TimeStratumCount + bins[i];
        }
        return strata;
    }

    /// <summary>Time strata of the partner scan's copies within events and within censored samples.</summary>
    public const int TimeStratumCount = 5;

    private static double[] ErrorCurve(SurvivalForest forest)
    {
        var curve = OutOfBagConcordanceCurve.Of(forest);
        for (int t = 0; t < curve.Length; t++) curve[t] = 1 - curve[t];
        return curve;
    }

    public override SingleMarkerStatistics SingleMarkers(Panel panel, int threadCount)
    {
        var markers = FollowUpScreen.Compute(panel.Matrix, _followUp.Times, _followUp.Events, threadCount: threadCount);
        return new SingleMarkerStatistics(new UnivariateTable([], [], []), [], markers,
            Ranking.OrdinalRanks(markers.Select(m => m.PValue).ToArray(), ScoreDirection.LowerIsBetter), -1);
    }

    /// <summary>
    /// The Cox score test (the log-rank type test of a continuous marker) on the marker's mid-ranks
    /// among the rows: ranks make it as robust to skewed omics values as the class rank test.
    /// </summary>
    public override double[] RankTestPValues(FeatureMatrix values, int[] rows, int threadCount)
    {
        var times = _followUp.Times;
        var events = _followUp.Events;
        var pValues = new double[values.FeatureCount];
        var time = times.ToArray();
        var observed = events.ToArray();
        Parallel.For(0, values.FeatureCount, WorkerThreads.Options(threadCount),
            () => new double[values.SampleCount],
            (feature, _, all) =>
            {
                MarkerValues.RankScale(values, feature, all);
                var kept = new List<int>(rows.Length);
                foreach (int row in rows) if (!double.IsNaN(all[row])) kept.Add(row);
                var marker = new double[kept.Count];
                for (int i = 0; i < marker.Length; i++) marker[i] = all[kept[i]];
                var ranks = Ranking.Rank(marker);
                var t = new double[kept.Count];
                var e = new bool[kept.Count];
                int eventCount = 0;
                for (int i = 0; i < kept.Count; i++)
                {
                    t[i] = time[kept[i]];
                    e[i] = observed[kept[i]];
                    if (e[i]) eventCount++;
                }
                double p = kept.Count < 3 || eventCount == 0 ? 1 : CoxSingleMarker.ScoreTest(t, e, ranks).PValue;
                pValues[feature] = double.IsNaN(p) ? 1 : p;
                return all;
            }, _ => { });
        return pValues;
    }

    public override PanelScore ScorePanel(BinnedMatrix matrix, ReadOnlySpan<int> features, int[] trainingRows, ReadOnlySpan<int> testRows,
        ForestOptions options)
    {
        var selected = matrix.SelectFeatures(features);
        var forest = SurvivalForestTrainer.Train(selected, _followUp, options, trainingRows);
        var risk = AtRows(forest.Risk(selected), testRows);
        double c = ConcordanceOf(testRows.ToArray(), i => risk[i], byPosition: true);
        return new PanelScore(c, 1 - c, risk, []);
    }

    /// <summary>Every test sample given the same risk: Harrell's C is then 0.5 (all pairs tied).</summary>
    public override PanelScore ChanceScore(int[] trainingRows, int[] testRows) =>
        new(0.5, 0.5, new double[testRows.Length], []);

    /// <summary>Harrell's C of a risk score over some samples; NaN with no comparable pair.</summary>
    private double ConcordanceOf(IReadOnlyList<int> samples, Func<int, double> risk, bool byPosition = false) =>
        SampleConcordance.Of(_followUp, samples, risk, byPosition);
}
