using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Forests;

/// <summary>One thread's buffers, sized once and reused for every tree it grows.</summary>
internal sealed class TreeWorker(int sampleCount, int maxRows, int featureCount, int maxCodeCount, int classCount, int scratchLength)
{
    private readonly int[] _counts = new int[sampleCount];
    private readonly int[] _drawScratch = new int[Math.Max(1, scratchLength)];
    private readonly int[] _rows = new int[maxRows];
    private readonly int[] _rowClasses = new int[maxRows];
    private readonly double[] _rowWeights = new double[maxRows];
    private readonly TreeBuilder _builder = new(Math.Max(1, maxRows), featureCount, maxCodeCount, classCount);

    /// <summary>
    /// The bytes of one worker on a panel of sampleCount rows and columnCount features: per
    /// row the draw counts, the draw scratch and its in-bag row, class and weight, held twice
    /// (here and in the builder), and the builder's packed increment of two-class rows; the
    /// builder's feature order and histograms; and a node buffer grown by doubling to fit the
    /// largest tree, at most 2n nodes on n rows.
    /// </summary>
    public static long BytesFor(long sampleCount, long columnCount, int classCount)
    {
        long rows = sampleCount * (sizeof(int) + sizeof(int) + sizeof(int) + sizeof(double)) * 2;
        long increments = classCount == 2 ? sampleCount * sizeof(ulong) : 0;
        long nodeBuffer = 2 * (2 * sampleCount) * DecisionTree.BytesPerNode(classCount);
        return rows + increments + sizeof(int) * columnCount + NodeHistogram.BytesFor(classCount)
            + PackedBinaryHistogram.Bytes + nodeBuffer;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public (DecisionTree, TreeOutOfBag) GrowTree(BinnedMatrix matrix, int[] classes, double[]? sampleWeights,
        SamplingPlan plan, ForestOptions options, int tree)
    {
        var eligible = plan.EligibleRows;
        foreach (int row in eligible) _counts[row] = 0;
        var sampling = SeedSchedule.Generator(options.Seed, options.Repeat, tree, SeedPurpose.Sampling);
        plan.Draw(ref sampling, _counts, _drawScratch);

        int inBag = 0, outOfBagCount = 0;
        foreach (int row in eligible)
        {
            int drawn = _counts[row];
            if (drawn == 0) { outOfBagCount++; continue; }
            double weight = drawn * (sampleWeights?[row] ?? 1.0);
            if (weight <= 0) continue;
            _rows[inBag] = row;
            _rowClasses[inBag] = classes[row];
            _rowWeights[inBag] = weight;
            inBag++;
        }
        if (inBag == 0) throw new InvalidOperationException($"Tree {tree} drew no sample with positive weight.");

        var splitting = SeedSchedule.Generator(options.Seed, options.Repeat, tree, SeedPurpose.Splitting);
        var grown = _builder.Grow(matrix, _rows.AsSpan(0, inBag), _rowClasses.AsSpan(0, inBag),
            _rowWeights.AsSpan(0, inBag), options.Tree, ref splitting);

        var oobRows = new int[outOfBagCount];
        var oobClasses = new int[outOfBagCount];
        int k = 0;
        foreach (int row in eligible)
        {
            if (_counts[row] != 0) continue;
            oobRows[k] = row;
            oobClasses[k] = grown.PredictClass(matrix, row);
            k++;
        }
        Array.Sort(oobRows, oobClasses);
        return (grown, new TreeOutOfBag(oobRows, oobClasses));
    }
}
