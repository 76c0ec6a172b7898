using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Forests;

/// <summary>
/// Grows the trees of a random forest (Breiman 2001, Machine Learning 45:5-32) in parallel.
/// Tree t draws its samples and features only from generators seeded by (seed, repeat, t,
/// purpose), created inside the work item, and is stored at its own index, so the forest is
/// bit-identical for any thread count and any split of the trees into batches.
/// </summary>
public static class ForestTrainer
{
    /// <param name="trainingRows">The rows trees may use, or null for all; other rows are neither in-bag nor out-of-bag.</param>
    /// <param name="sampleWeights">A weight per sample of the panel, or null for equal weights.</param>
    /// <param name="firstTree">Global index of the first tree to grow.</param>
    /// <param name="treeCount">How many trees to grow; null grows options.TreeCount - firstTree.</param>
    public static Forest Train(BinnedMatrix matrix, ClassOutcome outcome, ForestOptions options,
        int[]? trainingRows = null, double[]? sampleWeights = null, int firstTree = 0, int? treeCount = null)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(outcome);
        ArgumentNullException.ThrowIfNull(options);
        int sampleCount = matrix.SampleCount;
        if (outcome.SampleCount != sampleCount) throw new ArgumentException("The outcome must have one class per sample.");
        if (sampleWeights is not null && sampleWeights.Length != sampleCount)
            throw new ArgumentException("One weight per sample is needed.");
        if (sampleWeights is not null)
            foreach (double weight in sampleWeights)
                if (!(weight >= 0) || double.IsInfinity(weight)) throw new ArgumentException("Sample weights must be finite and not negative.");
        if (matrix.FeatureCount < 1) throw new ArgumentException("A forest needs at least one feature.");
        options.Validate(sampleCount);
        int count = treeCount ?? options.TreeCount - firstTree;
        if (firstTree < 0 || count < 1) throw new ArgumentException("The tree range is empty.");

        int[] eligible = trainingRows ?? Enumerable.Range(0, sampleCount).ToArray();
        ValidateRows(eligible, sampleCount);
        var classes = outcome.SampleClasses.ToArray();
        int classCount = outcome.ClassCount;
        var plan = new SamplingPlan(options.Sampling, eligible, classes, classCount);

        var trees = new DecisionTree[count];
        var outOfBag = new TreeOutOfBag[count];
        int threads = Math.Min(options.ResolveThreadCount(), count);
        int nextTree = -1;
        int maxCodeCount = matrix.MaxCodeCount;
        Parallel.For(0, threads, new ParallelOptions { MaxDegreeOfParallelism = threads }, _ =>
        {
            var worker = new TreeWorker(sampleCount, eligible.Length, matrix.FeatureCount, maxCodeCount, classCount, plan.ScratchLength);
            int index;
            // Trees are handed out by an atomic counter; where a tree is grown never affects what is grown.
            while ((index = Interlocked.Increment(ref nextTree)) < count)
            {
                int tree = firstTree + index;
                (trees[index], outOfBag[index]) = worker.GrowTree(matrix, classes, sampleWeights, plan, options, tree);
            }
        });
        return new Forest(options, firstTree, trees, outOfBag, sampleCount, matrix.FeatureCount, classCount);
    }

    /// <summary>The scratch memory of one training thread (its buffers, sized once), for memory estimates.</summary>
    public static long ScratchBytesPerThread(long sampleCount, long columnCount, int classCount) =>
        TreeWorker.BytesFor(sampleCount, columnCount, classCount);

    private static void ValidateRows(int[] rows, int sampleCount)
    {
        var seen = new bool[sampleCount];
        foreach (int row in rows)
        {
            if ((uint)row >= (uint)sampleCount) throw new ArgumentException($"Training row {row} is out of range.");
            if (seen[row]) throw new ArgumentException($"Training row {row} is listed twice.");
            seen[row] = true;
        }
    }
}
