using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Importance;

namespace OmicsScreen.Screening.Covariates;

/// <summary>Class outcomes: the out-of-bag Brier score increase of <see cref="OutOfBagTreeScorer"/>.</summary>
internal sealed class ClassTrackingLoss(Forest forest, BinnedMatrix matrix, int[] classes) : TrackingTreeLoss
{
    private readonly OutOfBagTreeScorer _scorer = new(matrix, classes);
    private int[] _splitFeatures = [];
    private ulong _treeSeed;

    public override string LossName => "brier_increase";

    public override BinnedMatrix Matrix => matrix;

    public override int TreeCount => forest.TreeCount;

    public override bool Begin(int tree)
    {
        var outOfBag = forest.OutOfBag(tree);
        if (outOfBag.Count == 0) return false;
        var decisionTree = forest.Tree(tree);
        _scorer.Begin(decisionTree, outOfBag);
        _splitFeatures = decisionTree.SplitFeatures();
        _treeSeed = OutOfBagTreeScorer.TreeSeed(forest, tree);
        return true;
    }

    public override ReadOnlySpan<int> Rows => _scorer.Rows;

    public override int[] SplitFeatures => _splitFeatures;

    public override ulong TreeSeed => _treeSeed;

    public override double MarginalRise(int feature)
    {
        var generator = OutOfBagTreeScorer.FeatureGenerator(_treeSeed, feature);
        return _scorer.ScoreFeature(feature, ref generator).BrierIncrease;
    }

    public override double RiseWithDonors(int feature, ReadOnlySpan<int> donors) => _scorer.BrierIncreaseWithDonors(feature, donors);
}
