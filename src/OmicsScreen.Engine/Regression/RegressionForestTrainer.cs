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
        if (sampleWeights is not null && sampleWeights.Length != sampleCount)
            throw new ArgumentException("One weight per sample is needed.");
        if (sampleWeights is not null)
            foreach (double weight in sampleWeights)
                if (!(weight >= 0) || double.IsInfinity(weight)) throw new ArgumentException("Sample weights must be finite and not negative.");
        if (matrix.FeatureCount < 1) throw new ArgumentException("A forest needs at least one feature.");
        if (options.Sampling.ClassBalanced) throw new ArgumentException("Class-balanced drawing needs classes; a measured outcome has none.");
        options.Validate(sampleCount);

        int[] eligible = trainingRows ?? Enumerable.Range(0, sampleCount).ToArray();
        var seen = new bool[sampleCount];
        foreach (int row in eligible)
        {
            if ((uint)row >= (uint)sampleCount) throw new ArgumentException($"Training row {row} is out of range.");
            if (seen[row]) throw new ArgumentException($"Training row {row} is listed twice.");
            seen[row] = true;
        }
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
            var counts = new int[sampleCount];
            var scratch = new int[Math.Max(1, plan.ScratchLength)];
            var rows = new int[Math.Max(1, eligible.Length)];
            var rowTargets = new double[rows.Length];
            var rowWeights = new double[rows.Length];
            var builder = new RegressionTreeBuilder(rows.Length, matrix.FeatureCount);
            int tree;
            // Trees are handed out by an atomic counter; where a tree is grown never affects what is grown.
            while ((tree = Interlocked.Increment(ref nextTree)) < count)
            {
                foreach (int row in eligible) counts[row] = 0;
                var sampling = SeedSchedule.Generator(options.Seed, options.Repeat, tree, SeedPurpose.Sampling);
                plan.Draw(ref sampling, counts, scratch);
                int inBag = 0, outOfBag = 0;
                foreach (int row in eligible)
                {
                    int drawn = counts[row];
                    if (drawn == 0) { outOfBag++; continue; }
                    double weight = drawn * (sampleWeights?[row] ?? 1.0);
                    if (weight <= 0) continue;
                    rows[inBag] = row;
                    rowTargets[inBag] = targets[row];
                    rowWeights[inBag] = weight;
                    inBag++;
                }
                if (inBag == 0) throw new InvalidOperationException($"Tree {tree} drew no sample with positive weight.");
                var splitting = SeedSchedule.Generator(options.Seed, options.Repeat, tree, SeedPurpose.Splitting);
                var grown = builder.Grow(matrix, rows.AsSpan(0, inBag), rowTargets.AsSpan(0, inBag),
                    rowWeights.AsSpan(0, inBag), options.Tree, ref splitting);
                var left = new int[outOfBag];
                var predicted = new double[outOfBag];
                int k = 0;
                // Eligible rows may come in any order; out-of-bag rows are stored sorted.
                foreach (int row in eligible)
                    if (counts[row] == 0) left[k++] = row;
                Array.Sort(left);
                for (int i = 0; i < left.Length; i++) predicted[i] = grown.Predict(matrix, left[i]);
                trees[tree] = grown;
                oobRows[tree] = left;
                oobPredictions[tree] = predicted;
            }
        });
        return new RegressionForest(options, trees, oobRows, oobPredictions, sampleCount, matrix.FeatureCount);
    }
}
