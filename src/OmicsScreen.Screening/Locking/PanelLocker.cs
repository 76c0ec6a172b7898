using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;

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
        var (markers, forestOptions) = Plan(panel, result, options);
        return Lock(panel, markers, forestOptions, options);
    }

    /// <summary>
    /// As <see cref="Lock(Panel, ScreenResult, PanelLockOptions)"/> for a measured outcome: the
    /// same markers and forest settings (the screen's smallest leaf for the kind), a regression forest.
    /// </summary>
    public static LockedMeasuredPanel LockMeasured(Panel panel, ScreenResult result, PanelLockOptions options)
    {
        var (markers, forestOptions) = Plan(panel, result, options);
        return LockMeasured(panel, markers, forestOptions, options);
    }

    /// <summary>
    /// As <see cref="Lock(Panel, ScreenResult, PanelLockOptions)"/> for censored follow-up: the
    /// same markers and forest settings (the screen's smallest leaf for the kind), a random survival forest.
    /// </summary>
    public static LockedFollowUpPanel LockFollowUp(Panel panel, ScreenResult result, PanelLockOptions options) =>
        LockFollowUpWithRiskGroups(panel, result, options).Panel;

    /// <summary>
    /// As <see cref="LockFollowUp(Panel, ScreenResult, PanelLockOptions)"/>, with the discovery
    /// risk groups: every discovery sample placed by its out-of-bag risk score against the
    /// panel's cut, as `apply` places a new cohort's samples (<see cref="DiscoveryRiskGroups"/>).
    /// </summary>
    public static (LockedFollowUpPanel Panel, LockedFollowUpPerformance DiscoveryRiskGroups) LockFollowUpWithRiskGroups(Panel panel,
        ScreenResult result, PanelLockOptions options)
    {
        var (markers, forestOptions) = Plan(panel, result, options);
        return LockFollowUpWithRiskGroups(panel, markers, forestOptions, options);
    }

    /// <summary>As <see cref="LockFollowUp(Panel, ReadOnlySpan{int}, ForestOptions, PanelLockOptions)"/>, with the discovery risk groups.</summary>
    public static (LockedFollowUpPanel Panel, LockedFollowUpPerformance DiscoveryRiskGroups) LockFollowUpWithRiskGroups(Panel panel,
        ReadOnlySpan<int> markerFeatures, ForestOptions forestOptions, PanelLockOptions options)
    {
        var (locked, risk) = LockFollowUpAndRisk(panel, markerFeatures, forestOptions, options);
        return (locked, DiscoveryRiskGroups(panel, risk, locked.RiskGroupCut));
    }

    /// <summary>
    /// The discovery samples split at the cut as <see cref="LockedFollowUpPanel.IsHighRisk"/>
    /// splits a new cohort (high when the risk score is above it), each scored by the trees that
    /// did not see it, so the curves are not flattered by in-bag fit: their Kaplan-Meier curves,
    /// the log-rank test between them and Harrell's C of the scores
    /// (<see cref="LockedPanelEvaluation.EvaluateFollowUp"/>). Samples without a score are left out.
    /// </summary>
    public static LockedFollowUpPerformance DiscoveryRiskGroups(Panel panel, ReadOnlySpan<double> riskScores, double cut)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var followUp = panel.FollowUp ?? throw new ArgumentException("Risk groups need follow-up times and events.");
        if (riskScores.Length != panel.SampleCount) throw new ArgumentException("The risk scores must have one value per sample.");
        var kept = new List<int>(riskScores.Length);
        for (int s = 0; s < riskScores.Length; s++) if (!double.IsNaN(riskScores[s])) kept.Add(s);
        var ids = new string[kept.Count];
        var risk = new double[kept.Count];
        var high = new bool[kept.Count];
        var time = new double[kept.Count];
        var events = new bool[kept.Count];
        for (int i = 0; i < kept.Count; i++)
        {
            int s = kept[i];
            (ids[i], risk[i], time[i], events[i]) = (panel.Matrix.SampleIds[s], riskScores[s], followUp.Times[s], followUp.Events[s]);
            high[i] = risk[i] > cut;
        }
        return LockedPanelEvaluation.EvaluateFollowUp(new LockedFollowUpScores(ids, risk, high, cut, []), time, events, horizon: null);
    }

    /// <summary>The markers to keep (panel indices, in shortlist order) and the locked forest's options.</summary>
    private static (int[] Markers, ForestOptions Options) Plan(Panel panel, ScreenResult result, PanelLockOptions options)
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
        return (markers, forestOptions);
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

    /// <summary>
    /// Locks the given features for a measured outcome: a regression forest on all discovery
    /// samples, with its out-of-bag R² and RMSE (<see cref="RegressionOutOfBag"/>).
    /// </summary>
    public static LockedMeasuredPanel LockMeasured(Panel panel, ReadOnlySpan<int> markerFeatures, ForestOptions forestOptions, PanelLockOptions options)
    {
        ArgumentNullException.ThrowIfNull(panel);
        ArgumentNullException.ThrowIfNull(forestOptions);
        ArgumentNullException.ThrowIfNull(options);
        if (markerFeatures.Length < 1) throw new ArgumentException("A locked panel needs at least one marker.");
        var outcome = panel.Measured ?? throw new ArgumentException("A measured panel needs a measured outcome.");
        var matrix = panel.Matrix.SelectFeatures(markerFeatures);
        var binned = new BinMapper().Bin(matrix, forestOptions.ThreadCount);
        // A measured outcome has no classes to balance.
        var regressionOptions = forestOptions with { Sampling = forestOptions.Sampling with { ClassBalanced = false } };
        var forest = RegressionForestTrainer.Train(binned, outcome.Values, regressionOptions);
        var outOfBag = new RegressionOutOfBag(forest, outcome.Values);
        var trees = new RegressionTree[forest.TreeCount];
        for (int t = 0; t < trees.Length; t++) trees[t] = forest.Tree(t);
        var locked = new LockedMeasuredPanel(matrix.FeatureNames.ToArray(), trees, outcome.ColumnName, Scales(matrix),
            outOfBag.RSquared, outOfBag.RootMeanSquaredError, Provenance(forestOptions, options, matrix.FeatureCount, forest.TreeCount, panel.SampleCount));
        locked.Validate();
        return locked;
    }

    /// <summary>
    /// Locks the given features for censored follow-up: a random survival forest on all discovery
    /// samples, its out-of-bag Harrell's C, and the median of the out-of-bag risk scores as the
    /// cut between the low- and high-risk groups (so the cut is not tuned on samples a tree has seen).
    /// </summary>
    public static LockedFollowUpPanel LockFollowUp(Panel panel, ReadOnlySpan<int> markerFeatures, ForestOptions forestOptions, PanelLockOptions options) =>
        LockFollowUpAndRisk(panel, markerFeatures, forestOptions, options).Panel;

    /// <summary>The locked follow-up panel and the discovery risk scores its cut is the median of (out of bag, or in bag when no sample ever was).</summary>
    private static (LockedFollowUpPanel Panel, double[] Risk) LockFollowUpAndRisk(Panel panel, ReadOnlySpan<int> markerFeatures, ForestOptions forestOptions,
        PanelLockOptions options)
    {
        ArgumentNullException.ThrowIfNull(panel);
        ArgumentNullException.ThrowIfNull(forestOptions);
        ArgumentNullException.ThrowIfNull(options);
        if (markerFeatures.Length < 1) throw new ArgumentException("A locked panel needs at least one marker.");
        var outcome = panel.FollowUp ?? throw new ArgumentException("A follow-up panel needs follow-up times and events.");
        var matrix = panel.Matrix.SelectFeatures(markerFeatures);
        var binned = new BinMapper().Bin(matrix, forestOptions.ThreadCount);
        var survivalOptions = forestOptions with { Sampling = forestOptions.Sampling with { ClassBalanced = false } };
        var forest = SurvivalForestTrainer.Train(binned, outcome.FollowUp, survivalOptions);
        var concordance = SurvivalImportance.OutOfBagConcordance(forest);

        var risk = forest.OutOfBagRisk();
        var finite = new List<double>(risk.Length);
        foreach (double r in risk) if (!double.IsNaN(r)) finite.Add(r);
        var sorted = finite.ToArray();
        Array.Sort(sorted);
        // A forest so small that no sample was ever out of bag has no out-of-bag median; the
        // in-bag risk of every sample is then the only cut there is.
        if (sorted.Length == 0)
        {
            risk = forest.Risk(binned);
            sorted = (double[])risk.Clone();
            Array.Sort(sorted);
        }
        double cut = Quantile.MedianOfSorted(sorted);

        var trees = new LockedRiskTree[forest.TreeCount];
        for (int t = 0; t < trees.Length; t++) trees[t] = new LockedRiskTree(forest.Tree(t).Topology, forest.Tree(t).Mortality.ToArray());
        var locked = new LockedFollowUpPanel(matrix.FeatureNames.ToArray(), trees, outcome.TimeColumn, outcome.EventColumn, Scales(matrix),
            concordance.Concordance, cut, outcome.EventCount,
            Provenance(forestOptions, options, matrix.FeatureCount, forest.TreeCount, panel.SampleCount));
        locked.Validate();
        return (locked, risk);
    }

    private static MarkerScale[] Scales(FeatureMatrix matrix)
    {
        var scales = new MarkerScale[matrix.FeatureCount];
        for (int f = 0; f < scales.Length; f++) scales[f] = MarkerScale.Describe(matrix, f);
        return scales;
    }

    private static LockProvenance Provenance(ForestOptions forestOptions, PanelLockOptions options, int markerCount, int treeCount, int sampleCount) =>
        new(options.ToolVersion, forestOptions.Seed, markerCount, treeCount, sampleCount, options.InputSha256);
}
