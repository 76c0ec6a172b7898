using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Sampling;

namespace OmicsScreen.Engine.Survival;

/// <summary>
/// Grows a random survival forest (Ishwaran et al. 2008) in parallel; as for class forests, tree
/// t draws only from generators seeded by (seed, repeat, t, purpose), so the forest is
/// bit-identical for any thread count.
/// </summary>
public static class SurvivalForestTrainer
{
    /// <param name="trainingRows">The rows trees may use, or null for all; other rows are neither in-bag nor out-of-bag.</param>
    public static SurvivalForest Train(BinnedMatrix matrix, FollowUpTimes followUp, ForestOptions options,
        int[]? trainingRows = null, double[]? sampleWeights = null)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(followUp);
        ArgumentNullException.ThrowIfNull(options);
        int sampleCount = matrix.SampleCount;
        if (followUp.SampleCount != sampleCount) throw new ArgumentException("The follow-up must have one time per sample.");
        TreeSampleDraw.CheckWeights(sampleWeights, sampleCount);
        if (matrix.FeatureCount < 1) throw new ArgumentException("A forest needs at least one feature.");
        if (options.Sampling.ClassBalanced) throw new ArgumentException("Class-balanced drawing needs classes; a follow-up outcome has none.");
        options.Validate(sampleCount);
        int[] eligible = TreeSampleDraw.EligibleRows(trainingRows, sampleCount);
        var plan = new SamplingPlan(options.Sampling, eligible, new int[sampleCount], 1);

        int count = options.TreeCount;
        var trees = new SurvivalTree[count];
        var oobRows = new int[count][];
        var oobMortality = new double[count][];
        int threads = Math.Min(options.ResolveThreadCount(), count);
        int nextTree = -1;
        Parallel.For(0, threads, new ParallelOptions { MaxDegreeOfParallelism = threads }, _ =>
        {
            var draw = new TreeSampleDraw(sampleCount, eligible.Length, plan.ScratchLength);
            var builder = new SurvivalTreeBuilder(followUp, Math.Max(1, eligible.Length), matrix.FeatureCount);
            int tree;
            // Trees are handed out by an atomic counter; where a tree is grown never affects what is grown.
            while ((tree = Interlocked.Increment(ref nextTree)) < count)
            {
                var left = draw.Draw(plan, sampleWeights, options.Seed, options.Repeat, tree);
                var splitting = SeedSchedule.Generator(options.Seed, options.Repeat, tree, SeedPurpose.Splitting);
                var grown = builder.Grow(matrix, draw.InBagRows, draw.InBagWeights, options.Tree, ref splitting);
                var mortality = new double[left.Length];
                for (int i = 0; i < left.Length; i++) mortality[i] = grown.MortalityOf(matrix, left[i]);
                trees[tree] = grown;
                oobRows[tree] = left;
                oobMortality[tree] = mortality;
            }
        });
        return new SurvivalForest(options, followUp, trees, oobRows, oobMortality, matrix.FeatureCount);
    }
}
