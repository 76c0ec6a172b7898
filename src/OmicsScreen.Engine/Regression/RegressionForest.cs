using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Regression;

/// <summary>
/// A grown regression forest: its trees, each tree's out-of-bag rows with that tree's
/// predictions, and the options that decided it. The forest predicts the mean of its trees'
/// predictions (Breiman 2001, section 11).
/// </summary>
public sealed class RegressionForest
{
    private readonly RegressionTree[] _trees;
    private readonly int[][] _outOfBagRows;
    private readonly double[][] _outOfBagPredictions;

    internal RegressionForest(ForestOptions options, RegressionTree[] trees, int[][] outOfBagRows,
        double[][] outOfBagPredictions, int sampleCount, int featureCount)
    {
        Options = options;
        _trees = trees;
        _outOfBagRows = outOfBagRows;
        _outOfBagPredictions = outOfBagPredictions;
        SampleCount = sampleCount;
        FeatureCount = featureCount;
    }

    public ForestOptions Options { get; }
    public int TreeCount => _trees.Length;
    public int SampleCount { get; }
    public int FeatureCount { get; }

    public RegressionTree Tree(int index) => _trees[index];

    /// <summary>The rows tree index left out of its bag, in increasing order.</summary>
    public ReadOnlySpan<int> OutOfBagRows(int index) => _outOfBagRows[index];

    /// <summary>Tree index's predictions for its out-of-bag rows, parallel to <see cref="OutOfBagRows"/>.</summary>
    public ReadOnlySpan<double> OutOfBagPredictions(int index) => _outOfBagPredictions[index];

    /// <summary>The forest's prediction for every sample of a binned matrix encoded like the training panel.</summary>
    public double[] Predict(BinnedMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        return Average(matrix.SampleCount, (tree, s) => tree.Predict(matrix, s));
    }

    /// <summary>The forest's prediction for every sample of a raw matrix with the training panel's features.</summary>
    public double[] Predict(FeatureMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        if (matrix.FeatureCount != FeatureCount) throw new ArgumentException("The matrix must have the training panel's features.");
        return Average(matrix.SampleCount, (tree, s) => tree.Predict(matrix, s));
    }

    /// <summary>Each sample's mean over the trees of their prediction (Breiman 2001, section 11).</summary>
    private double[] Average(int sampleCount, Func<RegressionTree, int, double> predict)
    {
        var predictions = new double[sampleCount];
        for (int s = 0; s < predictions.Length; s++)
        {
            double sum = 0;
            foreach (var tree in _trees) sum += predict(tree, s);
            predictions[s] = sum / _trees.Length;
        }
        return predictions;
    }

    /// <summary>
    /// Each feature's weighted variance decrease summed over a tree's splits, averaged over trees
    /// (unnormalised: in squared outcome units, per unit of root weight).
    /// </summary>
    public double[] MeanImpurityDecrease()
    {
        var mean = new double[FeatureCount];
        foreach (var tree in _trees) tree.AddImpurityDecreases(mean);
        for (int f = 0; f < mean.Length; f++) mean[f] /= _trees.Length;
        return mean;
    }
}
