using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Sampling;

namespace OmicsScreen.Engine.Regression;

/// <summary>
/// Grows the trees of a regression random forest (Breiman 2001) in parallel. As for class
/// forests, tree t draws its samples and features only from generators seeded by (seed,
/// repeat, t, purpose), so the forest is bit-identical for any thread count.
/// </summary>
public static class RegressionForestTrainer
{
    /// <param name="outcome">One finite value per sample of the matrix.</param>
    /// <param name="trainingRows">The rows trees may use, or null for all; other rows are neither in-bag nor out-of-bag.</param>
    /// <param name="sampleWeights">A weight per sample of the panel, or null for equal weights.</param>
    public static RegressionForest Train(BinnedMatrix matrix, ReadOnlySpan<double> outcome, ForestOptions options,
        int[]? trainingRows = null, double[]? sampleWeights = null)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(options);
        int sampleCount = matrix.SampleCount;
        if (outcome.Length != sampleCount) throw new ArgumentException("The outcome must have one value per sample.");
        foreach (double y in outcome)
            if (!double.IsFinite(y)) throw new ArgumentException("Every outcome value must be finite.");
        TreeSampleDraw.CheckWeights(sampleWeights, sampleCount);
        if (matrix.FeatureCount < 1) throw new ArgumentException("A forest needs at least one feature.");
        if (options.Sampling.ClassBalanced) throw new ArgumentException("Class-balanced drawing needs classes; a measured outcome has none.");
        options.Validate(sampleCount);

        int[] eligible = TreeSampleDraw.EligibleRows(trainingRows, sampleCount);
        var targets = outcome.ToArray();
        // One pseudo-class: the plan's per-class lists are only used by class-balanced drawing.
        var plan = new SamplingPlan(options.Sampling, eligible, new int[sampleCount], 1);

        int count = options.TreeCount;
        var trees = new RegressionTree[count];
        var oobRows = new int[count][];
        var oobPredictions = new double[count][];
        int threads = Math.Min(options.ResolveThreadCount(), count);
        int nextTree = -1;
        Parallel.For(0, threads, new ParallelOptions { MaxDegreeOfParallelism = threads }, _ =>
        {
            var draw = new TreeSampleDraw(sampleCount, eligible.Length, plan.ScratchLength);
            var rowTargets = new double[Math.Max(1, eligible.Length)];
            var builder = new RegressionTreeBuilder(rowTargets.Length, matrix.FeatureCount);
            int tree;
            // Trees are handed out by an atomic counter; where a tree is grown never affects what is grown.
            while ((tree = Interlocked.Increment(ref nextTree)) < count)
            {
                var left = draw.Draw(plan, sampleWeights, options.Seed, options.Repeat, tree);
                var inBag = draw.InBagRows;
                for (int i = 0; i < inBag.Length; i++) rowTargets[i] = targets[inBag[i]];
                var splitting = SeedSchedule.Generator(options.Seed, options.Repeat, tree, SeedPurpose.Splitting);
                var grown = builder.Grow(matrix, inBag, rowTargets.AsSpan(0, inBag.Length), draw.InBagWeights, options.Tree, ref splitting);
                var predicted = new double[left.Length];
                for (int i = 0; i < left.Length; i++) predicted[i] = grown.Predict(matrix, left[i]);
                trees[tree] = grown;
                oobRows[tree] = left;
                oobPredictions[tree] = predicted;
            }
        });
        return new RegressionForest(options, trees, oobRows, oobPredictions, sampleCount, matrix.FeatureCount);
    }
}
