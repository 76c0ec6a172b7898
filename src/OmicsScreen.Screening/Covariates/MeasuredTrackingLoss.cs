using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// Measured outcomes: the rise in the tree's out-of-bag mean squared error, scored by
/// <see cref="RegressionImportance.ErrorRise"/> on the permutation importance's own permutation
/// (<see cref="PermutedCodes"/>) or on the caller's.
/// </summary>
internal sealed class MeasuredTrackingLoss(RegressionForest forest, BinnedMatrix matrix, double[] values) : PermutedCodesTrackingLoss
{
    private int[] _rows = [];
    private int[] _splitFeatures = [];
    private RegressionTree? _tree;
    private double _baseError;
    private ulong _treeSeed;

    public override string LossName => "squared_error_rise";

    public override BinnedMatrix Matrix => matrix;

    public override int TreeCount => forest.TreeCount;

    public override bool Begin(int tree)
    {
        var rows = forest.OutOfBagRows(tree);
        if (rows.Length == 0) return false;
        _rows = rows.ToArray();
        _tree = forest.Tree(tree);
        _baseError = RegressionImportance.OutOfBagError(forest, tree, values, _rows);
        _splitFeatures = _tree.Topology.SplitFeatures();
        _treeSeed = RandomStreams.PermutationImportanceTree(new ForestStreams(forest.Options.Seed, forest.Options.Repeat), tree);
        EnsureCapacity(_rows.Length);
        return true;
    }

    public override ReadOnlySpan<int> Rows => _rows;

    public override int[] SplitFeatures => _splitFeatures;

    public override ulong TreeSeed => _treeSeed;

    protected override double RiseWith(int feature, ReadOnlySpan<byte> codes) =>
        RegressionImportance.ErrorRise(_tree!, matrix, values, _rows, _baseError, feature, codes);
}
