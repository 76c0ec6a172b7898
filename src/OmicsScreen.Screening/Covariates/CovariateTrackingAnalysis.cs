using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// Finds the shortlisted markers that only track a clinical covariate (every outcome kind).
/// </summary>
/// <remarks>
/// <para>Association: each marker against each covariate, Spearman's rho for a numeric covariate
/// and Kruskal-Wallis H with epsilon-squared for a categorical one, Benjamini-Hochberg over all
/// pairs. Association alone does not say a marker is a proxy: a true marker may correlate with
/// age and still carry its own signal.</para>
/// <para>Conditional importance (Strobl, Boulesteix, Kneib, Augustin &amp; Zeileis 2008, BMC
/// Bioinformatics 9:307): one forest on all samples with the markers and permuted copies of them
/// (decoys: the same values, no link to outcome or covariates), grown as the screen grows forests
/// of the outcome kind. For every tree and column, the out-of-bag rows' loss is measured again with
/// the column permuted among all out-of-bag rows (marginal importance) and permuted only within
/// the strata of one covariate (importance conditional on it). The loss is the one the screen's
/// permutation importance uses for the kind, read through its own scorer
/// (<see cref="TrackingTreeLoss"/>): the Brier score for classes, the squared error for a measured
/// outcome, Harrell's C of the tree's mortality for follow-up. A marker whose association with the outcome runs through age keeps its
/// age-related part under the within-age permutation, so its conditional importance falls to
/// that of the decoys; a marker with signal of its own loses it either way. The covariates are not
/// predictors of this forest: they only define the strata.</para>
/// <para>Flag: a marker "tracks" a covariate when it is associated with it (BH q at most 0.10),
/// its marginal importance is above the upper decile
/// of the decoys' marginal importances and more than 1.645 standard errors (over trees) above 0,
/// while its importance conditional on that covariate falls to the null: not above the upper
/// decile of the decoys' importances conditional on it, or not 1.645 standard errors above 0. The
/// second arm matters because a marker the forest splits on often has a noisier importance than
/// decoys it rarely splits on: on the tests' age-proxy simulation the proxies' conditional
/// importances scattered around 0 (-0.008 to +0.010, marginal 0.05-0.10) while the decoys' upper
/// decile was 0.0025. The proxy the forest used most still kept 5-12% of its marginal importance
/// (within-stratum age differences, 240 and 720 samples), significantly above 0, so a third arm
/// counts a marker that keeps less than a fifth (<see cref="RetainedShare"/>) as fallen to the
/// null; a marker with its own signal keeps about two thirds or more (within-stratum permutations
/// leave some out-of-bag rows in place).</para>
/// </remarks>
internal static class CovariateTrackingAnalysis
{
    /// <summary>Decoys grown beside the markers: at least this many, and one per marker beyond that.</summary>
    public const int MinimumDecoys = 20;

    /// <summary>The decoys' importance quantile a marker must exceed.</summary>
    public const double NullQuantile = 0.9;

    /// <summary>
    /// A marker keeping less than this share of its marginal importance once permuted within a
    /// covariate's strata has lost almost all of it to the covariate (see the remarks).
    /// </summary>
    public const double RetainedShare = 0.2;

    /// <summary>
    /// Benjamini-Hochberg level the marker's association with the covariate must reach: a marker
    /// can only stand in for a covariate it is associated with. Without it, a weak marker whose
    /// within-strata importance dipped under the decoys' by chance was flagged as tracking a
    /// covariate unrelated to everything (the demo's age, rho -0.08).
    /// </summary>
    public const double AssociationLevel = 0.10;

    /// <summary>One-sided 5% normal critical value: an importance whose mean over trees is not this many standard errors above 0 is indistinguishable from none.</summary>
    public const double OneSidedCritical = 1.6448536269514722;

    /// <summary>Null without covariates or shortlisted markers.</summary>
    public static CovariateTracking? Run(ScreenContext context, IReadOnlyList<int> shortlisted)
    {
        var panel = context.Panel;
        if (panel.Covariates.Count == 0 || shortlisted.Count == 0) return null;
        var associations = Associations(panel, shortlisted);

        int markers = shortlisted.Count;
        int decoys = Math.Max(MinimumDecoys, markers);
        var decoySources = new int[decoys];
        for (int d = 0; d < decoys; d++) decoySources[d] = d % markers;
        var streams = RandomStreams.TrackingForest(context.Options.Seed);
        BinnedMatrix matrix = context.Matrix.SelectFeatures(shortlisted.ToArray()).WithPermutedCopies(decoySources, streams.Seed, streams.Repeat, context.ThreadCount);
        var loss = GrowForest(panel, matrix, context.Settings.ForestOptions(context.Subject, streams));

        int covariateCount = panel.Covariates.Count;
        var strata = new int[covariateCount][];
        var strataCounts = new int[covariateCount];
        for (int c = 0; c < covariateCount; c++) strata[c] = CovariateStrata.Of(panel.Covariates[c], out strataCounts[c]);
        // importance[0, j] marginal, importance[1 + c, j] conditional on covariate c; the loss increase summed over trees.
        var importance = new double[1 + covariateCount, matrix.FeatureCount];
        var squares = new double[1 + covariateCount, matrix.FeatureCount];
        var treeIncrease = new double[1 + covariateCount, matrix.FeatureCount];
        var donors = Array.Empty<int>();
        for (int t = 0; t < loss.TreeCount; t++)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            Array.Clear(treeIncrease);
            TreeIncreases(loss, t, strata, strataCounts, ref donors, treeIncrease);
            for (int k = 0; k <= covariateCount; k++)
                for (int j = 0; j < matrix.FeatureCount; j++)
                {
                    importance[k, j] += treeIncrease[k, j];
                    squares[k, j] += treeIncrease[k, j] * treeIncrease[k, j];
                }
        }
        int trees = loss.TreeCount;
        // Mean over trees and its standard error SD / sqrt(trees) (randomForest's importance and
        // its standard error, Liaw & Wiener 2002, R News 2(3)): z = mean / SE.
        var z = new double[1 + covariateCount, matrix.FeatureCount];
        for (int k = 0; k <= covariateCount; k++)
            for (int j = 0; j < matrix.FeatureCount; j++)
            {
                double mean = importance[k, j] / trees;
                double variance = trees > 1 ? Math.Max(0, (squares[k, j] - trees * mean * mean) / (trees - 1)) : 0;
                double se = Math.Sqrt(variance / trees);
                importance[k, j] = mean;
                z[k, j] = se > 0 ? mean / se : 0;
            }

        var thresholds = new double[1 + covariateCount];
        var decoyValues = new double[decoys];
        for (int k = 0; k <= covariateCount; k++)
        {
            for (int d = 0; d < decoys; d++) decoyValues[d] = importance[k, markers + d];
            var sorted = decoyValues.ToArray();
            Array.Sort(sorted);
            thresholds[k] = Quantile.OfSorted(sorted, NullQuantile, QuantileDefinition.Linear);
        }
        var tracking = new MarkerTracking[markers];
        for (int m = 0; m < markers; m++)
        {
            var conditional = new double[covariateCount];
            var tracks = new List<string>();
            for (int c = 0; c < covariateCount; c++)
            {
                conditional[c] = importance[1 + c, m];
                bool important = importance[0, m] > thresholds[0] && z[0, m] > OneSidedCritical;
                bool fallsToNull = conditional[c] <= thresholds[1 + c] || z[1 + c, m] <= OneSidedCritical
                    || conditional[c] < RetainedShare * importance[0, m];
                double q = associations[m * covariateCount + c].QValue;
                if (important && fallsToNull && q <= AssociationLevel) tracks.Add(panel.Covariates[c].Name);
            }
            tracking[m] = new MarkerTracking(shortlisted[m], panel.Matrix.FeatureNames[shortlisted[m]], importance[0, m], conditional, tracks);
        }
        return new CovariateTracking(panel.Covariates.Select(c => c.Name).ToArray(), associations, tracking, thresholds[0],
            thresholds[1..], decoys, CovariateStrata.NumericStrata(panel.SampleCount)) { Loss = loss.LossName };
    }

    /// <summary>
    /// The tracking forest on all samples, grown as the screen's forests of the outcome kind are
    /// (class trees, regression trees, random survival trees), with its kind's permutation loss.
    /// </summary>
    private static TrackingTreeLoss GrowForest(Panel panel, BinnedMatrix matrix, ForestOptions options) => panel.Kind switch
    {
        OutcomeKind.Classes => new ClassTrackingLoss(ForestTrainer.Train(matrix, panel.Outcome, options, Enumerable.Range(0, panel.SampleCount).ToArray()),
            matrix, panel.Outcome.SampleClasses.ToArray()),
        OutcomeKind.Measured => MeasuredLoss(panel.Measured!, matrix, options),
        OutcomeKind.TimeToEvent => new FollowUpTrackingLoss(SurvivalForestTrainer.Train(matrix, panel.FollowUp!.FollowUp, options), matrix),
        _ => throw new ArgumentOutOfRangeException(nameof(panel), panel.Kind, "Unknown outcome kind."),
    };

    private static MeasuredTrackingLoss MeasuredLoss(MeasuredOutcome outcome, BinnedMatrix matrix, ForestOptions options)
    {
        var values = outcome.Values.ToArray();
        return new MeasuredTrackingLoss(RegressionForestTrainer.Train(matrix, values, options), matrix, values);
    }

    /// <summary>Every marker against every covariate, BH over all pairs; a cell not measured is left out.</summary>
    internal static MarkerCovariateAssociation[] Associations(Panel panel, IReadOnlyList<int> shortlisted)
    {
        var pairs = new List<(int Feature, int Covariate, string Test, double Effect, double P)>();
        foreach (int feature in shortlisted)
        {
            var values = new double[panel.SampleCount];
            var column = panel.Matrix.Column(feature);
            var states = panel.Matrix.States(feature);
            for (int s = 0; s < values.Length; s++)
                values[s] = !states.IsEmpty && states[s] == CellState.Missing ? double.NaN : column[s];
            for (int c = 0; c < panel.Covariates.Count; c++)
            {
                var covariate = panel.Covariates[c];
                if (covariate.IsCategorical)
                {
                    var levels = new int[panel.SampleCount];
                    for (int s = 0; s < levels.Length; s++) levels[s] = covariate.LevelOf(s);
                    var test = KruskalWallisTest.Test(values, levels, covariate.Levels.Count);
                    pairs.Add((feature, c, "kruskal_wallis", test.EpsilonSquared, test.PValue));
                }
                else
                {
                    var test = SpearmanTest.Test(values, covariate.Values);
                    pairs.Add((feature, c, "spearman", test.Rho, test.PValue));
                }
            }
        }
        // BH over the pairs with a p-value; a pair without one keeps q = NaN.
        var defined = pairs.Where(p => !double.IsNaN(p.P)).Select(p => p.P).ToArray();
        var q = BenjaminiHochberg.Adjust(defined);
        var result = new MarkerCovariateAssociation[pairs.Count];
        for (int i = 0, k = 0; i < pairs.Count; i++)
        {
            var p = pairs[i];
            double qValue = double.IsNaN(p.P) ? double.NaN : q[k++];
            result[i] = new MarkerCovariateAssociation(p.Feature, panel.Matrix.FeatureNames[p.Feature], panel.Covariates[p.Covariate].Name, p.Test, p.Effect, p.P, qValue);
        }
        return result;
    }

    /// <summary>
    /// Adds tree t's loss increases to <paramref name="importance"/>: for each column it splits
    /// on, its codes permuted among the out-of-bag rows (row 0, the permutation importance's own
    /// permutation) and within each covariate's strata (row 1 + covariate). A column the tree does
    /// not split on cannot change a leaf and adds 0.
    /// </summary>
    private static void TreeIncreases(TrackingTreeLoss loss, int t, int[][] strata, int[] strataCounts, ref int[] donors, double[,] importance)
    {
        if (!loss.Begin(t)) return;
        var rows = loss.Rows;
        if (donors.Length < rows.Length) donors = new int[rows.Length];
        ulong treeSeed = loss.TreeSeed;
        foreach (int feature in loss.SplitFeatures)
        {
            importance[0, feature] += loss.MarginalRise(feature);
            for (int c = 0; c < strata.Length; c++)
            {
                var generator = RandomStreams.StratifiedPermutation(treeSeed, c, feature);
                WithinStrata(rows, strata[c], strataCounts[c], donors, ref generator);
                importance[1 + c, feature] += loss.RiseWithDonors(feature, donors.AsSpan(0, rows.Length));
            }
        }
    }

    /// <summary>source[i] = a position of the same stratum as i, drawn as one permutation per stratum (positions in stratum order).</summary>
    private static void WithinStrata(ReadOnlySpan<int> rows, int[] strata, int strataCount, int[] source, ref Xoshiro256StarStar generator)
    {
        var members = new List<int>[strataCount];
        for (int s = 0; s < strataCount; s++) members[s] = [];
        for (int i = 0; i < rows.Length; i++) members[strata[rows[i]]].Add(i);
        foreach (var group in members)
        {
            var shuffled = group.ToArray();
            generator.Shuffle(shuffled.AsSpan());
            for (int k = 0; k < group.Count; k++) source[group[k]] = shuffled[k];
        }
    }
}
