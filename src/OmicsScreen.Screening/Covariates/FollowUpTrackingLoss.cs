using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// Follow-up outcomes: the drop in the tree's out-of-bag Harrell's C of its mortality, scored by
/// <see cref="SurvivalImportance.ConcordanceDrop"/> on the permutation importance's own
/// permutation (<see cref="PermutedCodes"/>) or on the caller's. As in the importance, a tree with
/// fewer than two out-of-bag rows or no comparable pair adds 0.
/// </summary>
internal sealed class FollowUpTrackingLoss(SurvivalForest forest, BinnedMatrix matrix) : PermutedCodesTrackingLoss
{
    private double[] _risk = [];
    private int[] _rows = [];
    private double[] _time = [];
    private bool[] _events = [];
    private int[] _splitFeatures = [];
    private SurvivalTree? _tree;
    private double _baseline;
    private ulong _treeSeed;

    public override string LossName => "concordance_drop";

    public override BinnedMatrix Matrix => matrix;

    public override int TreeCount => forest.TreeCount;

    public override bool Begin(int tree)
    {
        var rows = forest.OutOfBagRows(tree);
        if (rows.Length < 2) return false;
        _rows = rows.ToArray();
        (_time, _events) = SurvivalImportance.FollowUpOf(forest.FollowUp, _rows);
        var baseline = HarrellConcordance.Estimate(_time, _events, forest.OutOfBagMortality(tree));
        if (baseline.ComparablePairs == 0) return false;
        _baseline = baseline.Concordance;
        _tree = forest.Tree(tree);
        _splitFeatures = _tree.Topology.SplitFeatures();
        _treeSeed = RandomStreams.PermutationImportanceTree(new ForestStreams(forest.Options.Seed, forest.Options.Repeat), tree);
        EnsureCapacity(_rows.Length);
        if (_risk.Length < _rows.Length) _risk = new double[_rows.Length];
        return true;
    }

    public override ReadOnlySpan<int> Rows => _rows;

    public override int[] SplitFeatures => _splitFeatures;

    public override ulong TreeSeed => _treeSeed;

    protected override double RiseWith(int feature, ReadOnlySpan<byte> codes) =>
        SurvivalImportance.ConcordanceDrop(_tree!, matrix, _rows, _time, _events, _baseline, feature, codes, _risk.AsSpan(0, _rows.Length));
}
