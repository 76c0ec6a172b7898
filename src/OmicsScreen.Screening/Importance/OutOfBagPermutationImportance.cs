using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Parallelism;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Out-of-bag permutation importance (Breiman 2001, Machine Learning 45:5-32): per tree, permute
/// one feature's codes among the tree's out-of-bag rows, re-predict them, and record the drop in
/// accuracy and the increase in Brier score; average over all trees.
/// </summary>
/// <remarks>
/// Tree t's permutation of feature f comes from the generator of (forest seed, repeat, global
/// tree index, Permutation) folded with f (<see cref="OutOfBagTreeScorer.FeatureGenerator"/>),
/// made inside the work item, and the per-tree scores are summed in tree order, so the result is
/// the same for any thread count. A feature the tree does not split on cannot change its votes
/// and scores exactly 0 for that tree, so only split features are permuted. The importance is
/// the mean over all trees; its standard error is SD over trees / sqrt(trees), as in
/// randomForest's unscaled importance (Liaw &amp; Wiener 2002, R News 2(3)).
/// </remarks>
public static class OutOfBagPermutationImportance
{
    public static PermutationImportance Measure(Forest forest, BinnedMatrix matrix, ClassOutcome outcome, int threadCount = 0)
    {
        var classes = Validate(forest, matrix, outcome);
        var perTree = new TreePermutationScores[forest.TreeCount];
        TreeWork.ForEach(forest.TreeCount, threadCount, () => new OutOfBagTreeScorer(matrix, classes), (scorer, t) =>
        {
            var tree = forest.Tree(t);
            var outOfBag = forest.OutOfBag(t);
            if (outOfBag.Count == 0)
            {
                perTree[t] = TreePermutationScores.Empty;
                return;
            }
            scorer.Begin(tree, outOfBag);
            var used = tree.SplitFeatures();
            var drops = new double[used.Length];
            var increases = new double[used.Length];
            ulong treeSeed = OutOfBagTreeScorer.TreeSeed(forest, t);
            for (int i = 0; i < used.Length; i++)
            {
                var generator = OutOfBagTreeScorer.FeatureGenerator(treeSeed, used[i]);
                (drops[i], increases[i]) = scorer.ScoreFeature(used[i], ref generator);
            }
            perTree[t] = new TreePermutationScores(used, drops, increases);
        });
        return TreeScoreSummary.Summarise(perTree, forest.FeatureCount);
    }

    /// <summary>
    /// The plain reference: permutes every feature in every tree, sequentially, with the same
    /// permutations as <see cref="Measure"/>. Tests compare the two.
    /// </summary>
    internal static PermutationImportance MeasureNaive(Forest forest, BinnedMatrix matrix, ClassOutcome outcome)
    {
        var classes = Validate(forest, matrix, outcome);
        var scorer = new OutOfBagTreeScorer(matrix, classes);
        var perTree = new TreePermutationScores[forest.TreeCount];
        var all = new int[forest.FeatureCount];
        for (int f = 0; f < all.Length; f++) all[f] = f;
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var drops = new double[all.Length];
            var increases = new double[all.Length];
            scorer.Begin(forest.Tree(t), forest.OutOfBag(t));
            ulong treeSeed = OutOfBagTreeScorer.TreeSeed(forest, t);
            for (int f = 0; f < all.Length; f++)
            {
                var generator = OutOfBagTreeScorer.FeatureGenerator(treeSeed, f);
                (drops[f], increases[f]) = scorer.ScoreFeature(f, ref generator);
            }
            perTree[t] = new TreePermutationScores(all, drops, increases);
        }
        return TreeScoreSummary.Summarise(perTree, forest.FeatureCount);
    }

    /// <summary>
    /// Group permutation importance: the members of each group are permuted together, by one
    /// shared permutation of each tree's out-of-bag rows, so their dependence on each other is
    /// kept while their link to the outcome is broken (Strobl et al. 2008, BMC Bioinformatics 9:307;
    /// Nicodemus et al. 2010, BMC Bioinformatics 11:110, on why correlated features share marginal
    /// importance). Returns the mean accuracy drop per group over all trees; a tree using no
    /// member scores 0.
    /// </summary>
    public static double[] MeasureGroups(Forest forest, BinnedMatrix matrix, ClassOutcome outcome,
        IReadOnlyList<int[]> groups, int threadCount = 0)
    {
        var classes = Validate(forest, matrix, outcome);
        ArgumentNullException.ThrowIfNull(groups);
        int groupCount = groups.Count;
        for (int g = 0; g < groupCount; g++)
        {
            ArgumentNullException.ThrowIfNull(groups[g]);
            foreach (int member in groups[g])
                if ((uint)member >= (uint)forest.FeatureCount) throw new ArgumentException($"Group {g} names feature {member}, out of range.");
        }
        var perTree = new double[forest.TreeCount][];
        TreeWork.ForEach(forest.TreeCount, threadCount, () => (Scorer: new OutOfBagTreeScorer(matrix, classes), Used: new bool[forest.FeatureCount]),
            (worker, t) =>
            {
                var tree = forest.Tree(t);
                var outOfBag = forest.OutOfBag(t);
                var drops = new double[groupCount];
                perTree[t] = drops;
                if (outOfBag.Count == 0) return;
                var used = tree.SplitFeatures();
                foreach (int f in used) worker.Used[f] = true;
                worker.Scorer.Begin(tree, outOfBag);
                ulong treeSeed = OutOfBagTreeScorer.TreeSeed(forest, t);
                for (int g = 0; g < groupCount; g++)
                {
                    bool touches = false;
                    foreach (int member in groups[g]) touches |= worker.Used[member];
                    if (!touches) continue;
                    var generator = OutOfBagTreeScorer.GroupGenerator(treeSeed, g);
                    drops[g] = worker.Scorer.ScoreGroup(groups[g], ref generator);
                }
                foreach (int f in used) worker.Used[f] = false;
            });
        var mean = new double[groupCount];
        foreach (var drops in perTree)
            for (int g = 0; g < groupCount; g++) mean[g] += drops[g];
        for (int g = 0; g < groupCount; g++) mean[g] /= forest.TreeCount;
        return mean;
    }

    /// <summary>Runs work(worker, tree) for every tree; trees are handed out by an atomic counter and each result is stored by tree index.</summary>
    private static int[] Validate(Forest forest, BinnedMatrix matrix, ClassOutcome outcome)
    {
        ArgumentNullException.ThrowIfNull(forest);
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(outcome);
        if (matrix.FeatureCount != forest.FeatureCount || matrix.SampleCount != forest.SampleCount)
            throw new ArgumentException("The matrix must be the one the forest was grown on.");
        if (outcome.SampleCount != forest.SampleCount) throw new ArgumentException("The outcome must have one class per sample.");
        return outcome.SampleClasses.ToArray();
    }
}
