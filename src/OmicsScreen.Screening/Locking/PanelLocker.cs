using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Locking;

/// <summary>
/// Freezes the top markers of a screen into a <see cref="LockedPanel"/>: a forest grown on all
/// discovery samples using those markers only, with the decision threshold chosen on its
/// out-of-bag probabilities, so the threshold is not tuned on samples a tree has seen.
/// </summary>
public static class PanelLocker
{
    /// <summary>Repeat coordinate of the locked forest's streams (<see cref="RandomStreams.LockedPanelForest"/>).</summary>
    public const int LockRepeat = RandomStreams.LockRepeat;

    /// <summary>
    /// Keeps the first k markers of the shortlist (k = <see cref="PanelLockOptions.PanelSize"/>, or
    /// the screen's <see cref="ScreenResult.LockedPanelSize"/>; never more than the shortlist holds)
    /// and locks them. A marker that failed error control is never locked.
    /// </summary>
    public static LockedPanel Lock(Panel panel, ScreenResult result, PanelLockOptions options)
    {
        ArgumentNullException.ThrowIfNull(panel);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        if (result.Shortlist.Count == 0) throw new ArgumentException("The shortlist is empty, so there is no panel to lock.");
        int size = Math.Clamp(options.PanelSize ?? result.LockedPanelSize, 1, result.Shortlist.Count);
        var markers = new int[size];
        for (int i = 0; i < size; i++) markers[i] = result.Shortlist[i].Forest.FeatureIndex;
        // The panel forest tries floor(sqrt(k)) features per split of its own k, as the panel-size curve does.
        var screenOptions = result.Settings.ForestOptions(panel.Subject, RandomStreams.LockedPanelForest(options.Seed));
        var forestOptions = screenOptions with
        {
            TreeCount = options.TreeCount,
            ThreadCount = options.ThreadCount,
            Tree = screenOptions.Tree with { FeaturesPerSplit = null },
        };
        return Lock(panel, markers, forestOptions, options);
    }

    /// <summary>Locks the given features (panel indices, in the order they will be kept) with explicit forest options.</summary>
    public static LockedPanel Lock(Panel panel, ReadOnlySpan<int> markerFeatures, ForestOptions forestOptions, PanelLockOptions options)
    {
        ArgumentNullException.ThrowIfNull(panel);
        ArgumentNullException.ThrowIfNull(forestOptions);
        ArgumentNullException.ThrowIfNull(options);
        if (markerFeatures.Length < 1) throw new ArgumentException("A locked panel needs at least one marker.");
        if (panel.Outcome.ClassCount < 2) throw new ArgumentException("A locked panel needs at least two classes.");
        var matrix = panel.Matrix.SelectFeatures(markerFeatures);
        var outcome = panel.Outcome;
        var binned = new BinMapper().Bin(matrix, forestOptions.ThreadCount);
        var forest = ForestTrainer.Train(binned, outcome, forestOptions);
        var outOfBag = new OutOfBagVotes(forest, outcome);

        var trees = new DecisionTree[forest.TreeCount];
        for (int t = 0; t < trees.Length; t++) trees[t] = forest.Tree(t);
        var scales = new MarkerScale[matrix.FeatureCount];
        for (int f = 0; f < scales.Length; f++) scales[f] = MarkerScale.Describe(matrix, f);

        double? threshold = null;
        if (outcome.ClassCount == 2)
        {
            var scores = new double[panel.SampleCount];
            var positive = new bool[panel.SampleCount];
            var truth = outcome.SampleClasses;
            for (int s = 0; s < scores.Length; s++)
            {
                scores[s] = outOfBag.Probability(s, outcome.PositiveClass);
                positive[s] = truth[s] == outcome.PositiveClass;
            }
            threshold = YoudenThreshold.Choose(scores, positive);
        }
        var provenance = new LockProvenance(options.ToolVersion, forestOptions.Seed, matrix.FeatureCount,
            forest.TreeCount, panel.SampleCount, options.InputSha256);
        var locked = new LockedPanel(matrix.FeatureNames.ToArray(), trees, outcome.ClassNames.ToArray(), outcome.PositiveClass,
            scales, threshold, outOfBag.Auc, provenance);
        locked.Validate();
        return locked;
    }
}
