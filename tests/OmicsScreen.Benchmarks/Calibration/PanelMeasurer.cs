using System.Diagnostics;
using OmicsScreen.Engine.Metrics;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// Screens one calibration panel with the default options and measures the result against the
/// model's truth: discoveries, the decoy estimate, the univariate baseline, and the locked
/// panel's selection-aware estimate against its performance on a fresh cohort (AUC or accuracy
/// for classes, R^2 for a measured outcome, Harrell's C for follow-up).
/// </summary>
/// <remarks>
/// Reads only <see cref="ScreenResult.Shortlist"/>, <see cref="ScreenResult.Decoys"/>,
/// <see cref="ScreenResult.LockedPanelSize"/>, <see cref="ScreenResult.LockedPanelEstimate"/> and
/// the features' p-values, so it keeps measuring while the screen's error control changes.
/// </remarks>
public static class PanelMeasurer
{
    /// <summary>Fresh cohort number 1 of the model: never the discovery samples (cohort 0).</summary>
    private const int FreshCohortNumber = 1;

    public static PanelCalibration Measure(CalibrationModel model, CalibrationSettings settings)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(settings);
        var watch = Stopwatch.StartNew();
        var panel = model.Discovery();
        var truth = model.Truth;
        var result = ScreenRunner.Run(panel, settings.ScreenOptions(model.Seed));

        var shortlisted = new HashSet<int>();
        foreach (var entry in result.Shortlist) shortlisted.Add(entry.Forest.FeatureIndex);
        int trueDiscoveries = shortlisted.Count(f => truth[f]);
        int falseDiscoveries = shortlisted.Count - trueDiscoveries;

        var baseline = UnivariateBaseline.Discoveries(panel);
        int baselineDiscoveries = 0, baselineTrue = 0;
        for (int f = 0; f < baseline.Length; f++)
        {
            if (!baseline[f]) continue;
            baselineDiscoveries++;
            if (truth[f]) baselineTrue++;
        }

        bool? pairFound = null, baselinePairFound = null, thresholdFound = null, baselineThresholdFound = null;
        if (model.InteractingPair.Count > 0)
        {
            pairFound = model.InteractingPair.All(shortlisted.Contains);
            baselinePairFound = model.InteractingPair.All(f => baseline[f]);
        }
        if (model.ThresholdMarker >= 0)
        {
            thresholdFound = shortlisted.Contains(model.ThresholdMarker);
            baselineThresholdFound = baseline[model.ThresholdMarker];
        }

        var nullPValues = new List<double>(panel.FeatureCount);
        // Small p-values of unrelated features, per kind of evidence: which of them is liberal, if any.
        var smallShares = new int[3, 2];
        foreach (var feature in result.Features)
        {
            if (truth[feature.FeatureIndex]) continue;
            nullPValues.Add(feature.PValue);
            double[] evidence = [feature.ForestP, feature.RankTestP, feature.PValue];
            for (int e = 0; e < 3; e++)
            {
                if (evidence[e] <= 1e-3) smallShares[e, 0]++;
                if (evidence[e] <= 1e-4) smallShares[e, 1]++;
            }
        }

        // Forest partners (issue 19, part 5): a link is a shortlisted marker naming another as its
        // partner; only the planted pair's two links are true (the design plants no other interaction).
        int partnerLinks = 0, falsePartnerLinks = 0;
        bool pairNamed = false;
        var plantedPair = model.InteractingPair;
        foreach (var entry in result.Shortlist)
        {
            int marker = entry.Forest.FeatureIndex;
            foreach (int partner in result.Effects.Of(marker)?.Partners ?? [])
            {
                partnerLinks++;
                bool planted = plantedPair.Count == 2 && plantedPair.Contains(marker) && plantedPair.Contains(partner) && marker != partner;
                if (planted) pairNamed = true;
                else falsePartnerLinks++;
            }
        }

        int lockedSize = result.LockedPanelSize;
        double fresh = double.NaN;
        if (lockedSize > 0 && panel.Kind == OutcomeKind.Classes)
        {
            var locked = PanelLocker.Lock(panel, result, new PanelLockOptions { Seed = model.Seed, ThreadCount = settings.ThreadCount });
            var cohort = model.DrawFreshCohort(CalibrationSettings.FreshCohortSize, FreshCohortNumber);
            fresh = FreshEstimate(locked, cohort);
        }
        else if (lockedSize > 0)
        {
            var cohort = model.DrawFreshCohort(CalibrationSettings.FreshCohortSize, FreshCohortNumber);
            fresh = FreshCohortScore.Of(panel, result, Math.Min(lockedSize, result.Shortlist.Count), cohort, model.Seed, settings.ThreadCount);
        }
        double estimate = lockedSize > 0 ? result.LockedPanelEstimate : double.NaN;

        return new PanelCalibration(model.Name, model.Seed, model.IsNull, model.ClassCount, model.RelatedCount,
            shortlisted.Count, trueDiscoveries, falseDiscoveries, (double)falseDiscoveries / Math.Max(1, shortlisted.Count),
            result.Decoys.EstimatedFalseDiscoveryRate, baselineDiscoveries, baselineTrue,
            pairFound, baselinePairFound, thresholdFound, baselineThresholdFound,
            lockedSize, estimate, fresh, nullPValues.ToArray(), EstimateStandardError(result), SpecialMarkers(model, result), watch.Elapsed.TotalSeconds)
        {
            Kind = model.Kind,
            EventShare = panel.FollowUp is { } followUp ? followUp.EventCount / (double)followUp.SampleCount : double.NaN,
            FoldsWithoutPanel = result.PanelSize?.FoldsWithoutPanel ?? -1,
            CurveFolds = result.PanelSize is { } curve ? curve.FoldCount * curve.FoldRepeats : 0,
            MeanFoldPanelSize = result.PanelSize?.MeanFoldPanelSize ?? double.NaN,
            FalseEntries = FalseEntries(panel, truth, result),
            MissedEntries = MissedEntries(truth, baseline, shortlisted, result),
            PairNamedAsPartners = plantedPair.Count > 0 ? pairNamed : null,
            PartnerLinks = partnerLinks,
            FalsePartnerLinks = falsePartnerLinks,
            SmallNullPValues = FormattableString.Invariant(
                $"forest {smallShares[0, 0]}/{smallShares[0, 1]}, rank {smallShares[1, 0]}/{smallShares[1, 1]}, final {smallShares[2, 0]}/{smallShares[2, 1]} of {nullPValues.Count}"),
        };
    }

    /// <summary>The DeLong standard error of the locked procedure's pooled held-out AUC; NaN when there is none (and for other outcome kinds).</summary>
    private static double EstimateStandardError(ScreenResult result)
    {
        var curve = result.PanelSize;
        if (result.Kind != OutcomeKind.Classes || result.LockedPanelSize == 0 || curve is null || curve.LockedOutOfFoldScores.Count == 0) return double.NaN;
        var positive = new List<double>();
        var negative = new List<double>();
        for (int i = 0; i < curve.LockedOutOfFoldScores.Count; i++)
            (curve.LockedOutOfFoldPositive[i] ? positive : negative).Add(curve.LockedOutOfFoldScores[i]);
        return Math.Sqrt(Screening.Statistics.DeLong.Estimate(positive.ToArray(), negative.ToArray()).Variance);
    }

    /// <summary>
    /// One item per false shortlisted marker: its list position, selection frequency, the forest's,
    /// rank test's and final p, q, and its largest |Pearson r| with any related feature on the
    /// discovery samples (is it a carrier's correlate?).
    /// </summary>
    private static string FalseEntries(Panel panel, IReadOnlyList<bool> truth, ScreenResult result)
    {
        var related = new List<int>();
        for (int f = 0; f < truth.Count; f++) if (truth[f]) related.Add(f);
        var items = new List<string>();
        foreach (var entry in result.Shortlist)
        {
            int feature = entry.Forest.FeatureIndex;
            if (truth[feature]) continue;
            double largest = double.NaN;
            foreach (int r in related)
            {
                double c = Math.Abs(Pearson(panel.Matrix.Column(feature), panel.Matrix.Column(r)));
                if (double.IsNaN(largest) || c > largest) largest = c;
            }
            var s = entry.Forest;
            items.Add(FormattableString.Invariant(
                $"f{feature} order {s.Order} freq {s.SelectionFrequency:F2} forest p {s.ForestP:G2} rank p {s.RankTestP:G2} p {s.PValue:G2} q {s.QValue:G2} max|r| {largest:F2}"));
        }
        return string.Join("; ", items);
    }

    /// <summary>
    /// One item per related feature the baseline found and the screen did not list: its screen
    /// order, selection frequency, forest, rank-test and final p and q, for reading a loss of power.
    /// </summary>
    private static string MissedEntries(IReadOnlyList<bool> truth, bool[] baseline, HashSet<int> shortlisted, ScreenResult result)
    {
        var items = new List<string>();
        foreach (var s in result.Features)
        {
            int f = s.FeatureIndex;
            if (!truth[f] || !baseline[f] || shortlisted.Contains(f)) continue;
            items.Add(FormattableString.Invariant(
                $"f{f} order {s.Order} freq {s.SelectionFrequency:F2} forest p {s.ForestP:G2} rank p {s.RankTestP:G2} p {s.PValue:G2} q {s.QValue:G2}"));
        }
        return string.Join("; ", items);
    }

    private static double Pearson(ReadOnlySpan<float> x, ReadOnlySpan<float> y)
    {
        double mx = 0, my = 0;
        int n = 0;
        for (int i = 0; i < x.Length; i++)
            if (float.IsFinite(x[i]) && float.IsFinite(y[i])) { mx += x[i]; my += y[i]; n++; }
        if (n < 3) return double.NaN;
        mx /= n;
        my /= n;
        double sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++)
        {
            if (!float.IsFinite(x[i]) || !float.IsFinite(y[i])) continue;
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
            syy += (y[i] - my) * (y[i] - my);
        }
        return sxy / Math.Sqrt(sxx * syy);
    }

    /// <summary>One "role: order N, forest p, rank p, p, q" item per interacting or threshold marker.</summary>
    private static string SpecialMarkers(CalibrationModel model, ScreenResult result)
    {
        var roles = new List<(string Role, int Feature)>();
        foreach (int f in model.InteractingPair) roles.Add(("pair", f));
        if (model.ThresholdMarker >= 0) roles.Add(("threshold", model.ThresholdMarker));
        var items = new List<string>();
        foreach (var (role, feature) in roles)
        {
            var summary = result.Features.First(x => x.FeatureIndex == feature);
            items.Add(FormattableString.Invariant(
                $"{role}: order {summary.Order}, forest p {summary.ForestP:G2}, rank p {summary.RankTestP:G2}, p {summary.PValue:G2}, q {summary.QValue:G2}"));
        }
        return string.Join("; ", items);
    }

    /// <summary>
    /// The locked panel on a fresh cohort, in the measure of the selection-aware estimate: the AUC of
    /// the positive class's vote share for two classes (Mann-Whitney form), else the share of
    /// samples whose called class is right.
    /// </summary>
    private static double FreshEstimate(LockedPanel locked, Panel cohort)
    {
        var scores = LockedPanelScorer.Score(locked, cohort.Matrix);
        var truth = cohort.Outcome.SampleClasses;
        if (locked.IsBinary)
        {
            var probability = new double[scores.SampleCount];
            var positive = new bool[scores.SampleCount];
            for (int s = 0; s < probability.Length; s++)
            {
                probability[s] = scores.Probability(s, scores.PositiveClass);
                positive[s] = truth[s] == scores.PositiveClass;
            }
            return MannWhitneyAuc.Compute(probability, positive);
        }
        int right = 0;
        for (int s = 0; s < scores.SampleCount; s++) if (scores.PredictedClasses[s] == truth[s]) right++;
        return (double)right / scores.SampleCount;
    }
}
