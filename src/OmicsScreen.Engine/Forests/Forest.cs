using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Forests;

/// <summary>
/// Trees firstTree..firstTree+TreeCount-1 of a forest, in tree order, each with its out-of-bag
/// samples. Batches grown separately combine into the forest grown at once.
/// </summary>
public sealed class Forest
{
    private readonly DecisionTree[] _trees;
    private readonly TreeOutOfBag[] _outOfBag;

    internal Forest(ForestOptions options, int firstTree, DecisionTree[] trees, TreeOutOfBag[] outOfBag,
        int sampleCount, int featureCount, int classCount)
    {
        Options = options;
        FirstTree = firstTree;
        _trees = trees;
        _outOfBag = outOfBag;
        SampleCount = sampleCount;
        FeatureCount = featureCount;
        ClassCount = classCount;
    }

    public ForestOptions Options { get; }
    /// <summary>Global index of the first tree (its seed coordinate).</summary>
    public int FirstTree { get; }
    public int TreeCount => _trees.Length;
    public int SampleCount { get; }
    public int FeatureCount { get; }
    public int ClassCount { get; }

    /// <summary>The tree at position index (global index FirstTree + index).</summary>
    public DecisionTree Tree(int index) => _trees[index];

    public TreeOutOfBag OutOfBag(int index) => _outOfBag[index];

    /// <summary>The trees in order.</summary>
    public IEnumerable<DecisionTree> Enumerate() => _trees;

    /// <summary>Joins batches of trees of one forest, which must cover consecutive tree ranges.</summary>
    public static Forest Combine(IReadOnlyList<Forest> batches)
    {
        ArgumentNullException.ThrowIfNull(batches);
        if (batches.Count == 0) throw new ArgumentException("Nothing to combine.");
        var ordered = batches.OrderBy(b => b.FirstTree).ToArray();
        var first = ordered[0];
        var trees = new List<DecisionTree>();
        var outOfBag = new List<TreeOutOfBag>();
        int next = first.FirstTree;
        foreach (var batch in ordered)
        {
            if (batch.FirstTree != next) throw new ArgumentException("The batches do not cover consecutive trees.");
            if (batch.SampleCount != first.SampleCount || batch.FeatureCount != first.FeatureCount
                || batch.ClassCount != first.ClassCount || batch.Options.Seed != first.Options.Seed
                || batch.Options.Repeat != first.Options.Repeat)
                throw new ArgumentException("The batches come from different forests.");
            trees.AddRange(batch._trees);
            outOfBag.AddRange(batch._outOfBag);
            next += batch.TreeCount;
        }
        return new Forest(first.Options with { TreeCount = trees.Count }, first.FirstTree, trees.ToArray(),
            outOfBag.ToArray(), first.SampleCount, first.FeatureCount, first.ClassCount);
    }

    /// <summary>Every tree's vote for every sample of a matrix binned with the training bins.</summary>
    public ForestPrediction Predict(BinnedMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        var votes = new int[matrix.SampleCount * ClassCount];
        foreach (var tree in _trees)
            for (int s = 0; s < matrix.SampleCount; s++) votes[s * ClassCount + tree.PredictClass(matrix, s)]++;
        return Tally(votes, matrix.SampleCount);
    }

    /// <summary>Every tree's vote for every sample of a raw matrix with the training features in order.</summary>
    public ForestPrediction Predict(FeatureMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        if (matrix.FeatureCount != FeatureCount) throw new ArgumentException("The matrix must have the training features, in order.");
        var votes = new int[matrix.SampleCount * ClassCount];
        foreach (var tree in _trees)
            for (int s = 0; s < matrix.SampleCount; s++) votes[s * ClassCount + tree.PredictClass(matrix, s)]++;
        return Tally(votes, matrix.SampleCount);
    }

    private ForestPrediction Tally(int[] votes, int sampleCount)
    {
        var tieBreaker = new VoteTieBreaker(Options.Seed, Options.Repeat, sampleCount, ClassCount);
        var predicted = new int[sampleCount];
        for (int s = 0; s < sampleCount; s++)
            predicted[s] = tieBreaker.Winner(s, votes.AsSpan(s * ClassCount, ClassCount));
        return new ForestPrediction(votes, predicted, ClassCount, TreeCount);
    }
}
