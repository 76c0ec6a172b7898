using System.Diagnostics;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Covariates;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Runs a whole screen on a panel: bin once, univariate statistics, a reference forest, the
/// repeated half-sample forests, aggregation into a stability-ranked shortlist with error
/// control, redundancy groups, and the selection-aware panel-size curve.
/// </summary>
public static class ScreenRunner
{
    /// <param name="store">
    /// Where finished work units are kept and found: units already in it are not computed again
    /// (resuming a killed run), new ones are saved as soon as they finish.
    /// </param>
    /// <param name="computeMissing">False when every unit must come from <paramref name="store"/> (merging parts).</param>
    public static ScreenResult Run(Panel panel, ScreenOptions options, IProgress<ScreenProgress>? progress = null,
        CancellationToken cancellation = default, IWorkUnitStore? store = null, bool computeMissing = true)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var settings = ScreenSettings.Resolve(options, panel);
        var seconds = new Dictionary<ScreenStage, double>();
        var watch = Stopwatch.StartNew();
        void Finish(ScreenStage stage)
        {
            seconds[stage] = watch.Elapsed.TotalSeconds;
            watch.Restart();
        }

        progress?.Report(new ScreenProgress(ScreenStage.Binning, 0, 1));
        var matrix = new BinMapper().Bin(panel.Matrix, settings.ThreadCount);
        var context = new ScreenContext(panel, matrix, settings, progress, cancellation);
        Finish(ScreenStage.Binning);

        progress?.Report(new ScreenProgress(ScreenStage.UnivariateStatistics, 0, 1));
        var model = context.ScreenOutcome;
        var singleMarkers = model.SingleMarkers(panel, settings.ThreadCount);
        var univariate = singleMarkers.Classes;
        Finish(ScreenStage.UnivariateStatistics);

        progress?.Report(new ScreenProgress(ScreenStage.ReferenceForest, 0, 1));
        var referenceForest = model.GrowReference(matrix, settings.ForestOptions(panel.Subject, RandomStreams.ReferenceForest(options.Seed)));
        var reference = referenceForest.Summary;
        Finish(ScreenStage.ReferenceForest);

        var work = new ScreenWork(context, store, computeMissing);
        var repeats = work.MainRepeats();
        Finish(ScreenStage.Repeats);

        double[] outcomePermutationP = [];
        if (options.OutcomePermutations > 0 && panel.Kind == OutcomeKind.Classes)
        {
            progress?.Report(new ScreenProgress(ScreenStage.OutcomePermutations, 0, options.OutcomePermutations));
            var observed = CorrectedImpurityImportance.Measure(matrix, panel.Outcome, null, [],
                settings.ForestOptions(panel.Subject, RandomStreams.ReferenceForest(options.Seed)));
            outcomePermutationP = OutcomePermutationNull.PValues(matrix, panel.Outcome, null, observed.Features,
                options.OutcomePermutations, settings.ForestOptions(panel.Subject, RandomStreams.ReferenceForest(options.Seed)),
                new Progress<int>(done => progress?.Report(new ScreenProgress(ScreenStage.OutcomePermutations, done, options.OutcomePermutations))));
            Finish(ScreenStage.OutcomePermutations);
        }

        var allRows = Enumerable.Range(0, panel.SampleCount).ToArray();
        var plan = DecoyPlan.For(panel.FeatureCount, settings.DecoyCount, options.Seed);
        var direct = DirectTestEvidence.Compute(context, allRows, plan);
        var decoyEvidence = DecoyEvidence.From(repeats, direct);
        var features = ScreenAggregation.Summarise(repeats, panel.Matrix.FeatureNames, decoyEvidence, outcomePermutationP, direct);
        var order = ScreenAggregation.OrderOf(features);
        var (shortlistedFeatures, decoys) = ShortlistSelection.Apply(features, order, decoyEvidence, options);
        var shortlisted = shortlistedFeatures.ToList();
        double meanSelected = SelectionStability.MeanSelectedCount(repeats.Selected, repeats.FeatureCount);
        var stability = new StabilitySummary(
            SelectionStability.Nogueira(repeats.Selected, repeats.FeatureCount),
            meanSelected,
            options.FrequencyThreshold,
            options.FrequencyThreshold > 0.5
                ? StabilitySelectionBound.ExpectedFalseSelections(meanSelected, options.FrequencyThreshold, repeats.FeatureCount)
                : double.NaN)
        {
            ListStability = ListStability(repeats, shortlisted.Count),
        };

        var groups = RedundancyGroups.Assign(panel.Matrix, shortlisted, options.RedundancyCorrelation, out var correlations);
        var groupMembers = new List<int[]>();
        for (int g = 1; g <= (groups.Length == 0 ? 0 : groups.Max()); g++)
            groupMembers.Add(shortlisted.Where((_, i) => groups[i] == g).ToArray());
        var groupImportance = groupMembers.Count == 0 ? []
            : referenceForest.GroupImportance?.Invoke(matrix, groupMembers, settings.ThreadCount)
              ?? Enumerable.Repeat(double.NaN, groupMembers.Count).ToArray();
        var shortlist = shortlisted.Select((f, i) => singleMarkers.Entry(i + 1, features[f], groups[i], groupImportance[groups[i] - 1])).ToList();

        progress?.Report(new ScreenProgress(ScreenStage.Effects, 0, 1));
        var effects = EffectAnalysis.Run(context, referenceForest.LeafValues, shortlisted, order);
        Finish(ScreenStage.Effects);

        PanelSizeCurve? curve = null;
        if (options.CurveFolds > 0)
        {
            int foldTotal = options.CurveFolds * options.CurveFoldRepeats;
            progress?.Report(new ScreenProgress(ScreenStage.PanelSizeCurve, 0, foldTotal));
            curve = PanelSizeEstimator.Estimate(context, order, shortlisted.Count, work);
            Finish(ScreenStage.PanelSizeCurve);
        }

        // What the panel adds over the clinical covariates, in the curve's own outer folds.
        var addedValue = curve is null ? null : AddedValueEstimator.Estimate(context, work.CurveFolds, curve);
        // Which shortlisted markers only track a covariate (class outcomes).
        var tracking = CovariateTrackingAnalysis.Run(context, shortlisted);

        CohortResult? cohorts = null;
        if (panel.Cohort is { LevelCount: >= 2 })
        {
            progress?.Report(new ScreenProgress(ScreenStage.Cohorts, 0, 1));
            cohorts = CohortAnalysis.Run(context, order, singleMarkers, work);
            Finish(ScreenStage.Cohorts);
        }

        // The locked panel is the shortlist or a prefix of it, never padded with markers that
        // failed error control; without the curve it is the whole list, up to the curve's size limit.
        int lockedSize = curve?.LockedSize ?? Math.Min(shortlist.Count, options.CurveMaxPanelSize);
        double lockedEstimate = curve?.LockedEstimate ?? double.NaN;
        return new ScreenResult(settings, repeats, features, order, shortlist, correlations, stability, decoys, reference,
            univariate, singleMarkers.Ranks, curve, seconds, cohorts)
        {
            LockedPanelSize = lockedSize,
            LockedPanelEstimate = lockedEstimate,
            MeasuredMarkers = singleMarkers.Measured,
            FollowUpMarkers = singleMarkers.FollowUp,
            Kind = panel.Kind,
            Effects = effects,
            AddedValue = addedValue,
            CovariateTracking = tracking,
        };
    }

    /// <summary>
    /// Computes only the given units of a screen and saves each in <paramref name="store"/>: one
    /// part of a run split over machines (<see cref="WorkPlan.UnitsOfPart"/>). Units already in
    /// the store are kept, so a killed part can be run again and resumes.
    /// </summary>
    public static void RunUnits(Panel panel, ScreenOptions options, IReadOnlyList<WorkUnit> units, IWorkUnitStore store,
        IProgress<ScreenProgress>? progress = null, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var settings = ScreenSettings.Resolve(options, panel);
        progress?.Report(new ScreenProgress(ScreenStage.Binning, 0, 1));
        var matrix = new BinMapper().Bin(panel.Matrix, settings.ThreadCount);
        var work = new ScreenWork(new ScreenContext(panel, matrix, settings, progress, cancellation), store);
        for (int i = 0; i < units.Count; i++)
        {
            progress?.Report(new ScreenProgress(ScreenStage.WorkUnits, i, units.Count));
            work.Obtain(units[i]);
        }
        progress?.Report(new ScreenProgress(ScreenStage.WorkUnits, units.Count, units.Count));
    }

    /// <summary>
    /// Nogueira et al. (2018) stability of the list a repeat would give at the shortlist's length:
    /// each repeat's top <paramref name="listLength"/> features by combined rank. It says how much
    /// a list of this length changes from one half of the samples to another; NaN for an empty list.
    /// </summary>
    internal static StabilityEstimate ListStability(RepeatImportances repeats, int listLength)
    {
        int featureCount = repeats.FeatureCount, repeatCount = repeats.RepeatCount;
        if (listLength < 1 || listLength >= featureCount || repeatCount < 2)
            return new StabilityEstimate(double.NaN, double.NaN, ConfidenceInterval.Undefined(0.95), listLength, repeatCount, featureCount);
        var selections = new bool[repeatCount * featureCount];
        for (int r = 0; r < repeatCount; r++)
        {
            var order = Ranking.BestFirst(repeats.Row(repeats.CombinedRank, r), ScoreDirection.LowerIsBetter);
            for (int i = 0; i < listLength; i++) selections[r * featureCount + order[i]] = true;
        }
        return SelectionStability.Nogueira(selections, featureCount);
    }
}
