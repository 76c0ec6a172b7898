using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Scores one tree at a time on its out-of-bag rows: the baseline accuracy and Brier score, then
/// the same with one feature (or one group of features) permuted among those rows. One scorer per
/// thread; its buffers are sized once and reused for every tree.
/// </summary>
/// <remarks>
/// Brier score of a row (Brier 1950, Monthly Weather Review 78(1)), multi-class form:
/// sum over classes c of (p_c - [y = c])^2 = sum_c p_c^2 - 2 p_y + 1, where p is the class
/// distribution of the leaf the row reaches (its training class weights divided by their total).
/// The tree's score is the mean over its out-of-bag rows; lower is better.
/// </remarks>
internal sealed class OutOfBagTreeScorer
{
    private readonly BinnedMatrix _matrix;
    private readonly int[] _classes;
    private readonly bool[] _inGroup;
    private int[] _positions = [];
    private int[] _permutedRows = [];
    private double[] _nodeSquaredSum = [];
    private double[] _nodeWeight = [];
    private DecisionTree? _tree;
    private int[] _rows = [];
    private int _rowCount;
    private int _baselineCorrect;
    private double _baselineBrier;

    public OutOfBagTreeScorer(BinnedMatrix matrix, int[] classes)
    {
        _matrix = matrix;
        _classes = classes;
        _inGroup = new bool[matrix.FeatureCount];
    }

    /// <summary>The seed all of one tree's permutations derive from; a function of the forest and the tree only.</summary>
    public static ulong TreeSeed(Forest forest, int treeIndex) =>
        SeedSchedule.Derive(forest.Options.Seed, forest.Options.Repeat, forest.FirstTree + treeIndex, SeedPurpose.Permutation);

    /// <summary>The generator permuting one feature in one tree.</summary>
    public static Xoshiro256StarStar FeatureGenerator(ulong treeSeed, int feature) =>
        SeedSchedule.Generator(treeSeed, 0, feature, SeedPurpose.Permutation);

    /// <summary>The generator permuting one group in one tree; repeat coordinate 1 keeps it apart from feature streams.</summary>
    public static Xoshiro256StarStar GroupGenerator(ulong treeSeed, int group) =>
        SeedSchedule.Generator(treeSeed, 1, group, SeedPurpose.Permutation);

    public int RowCount => _rowCount;

    /// <summary>Loads a tree and its out-of-bag rows and scores the unpermuted baseline.</summary>
    public void Begin(DecisionTree tree, TreeOutOfBag outOfBag)
    {
        _tree = tree;
        _rowCount = outOfBag.Count;
        if (_rows.Length < _rowCount)
        {
            _rows = new int[_rowCount];
            _positions = new int[_rowCount];
            _permutedRows = new int[_rowCount];
        }
        outOfBag.Rows.CopyTo(_rows);
        int nodeCount = tree.NodeCount, classCount = tree.ClassCount;
        if (_nodeSquaredSum.Length < nodeCount)
        {
            _nodeSquaredSum = new double[nodeCount];
            _nodeWeight = new double[nodeCount];
        }
        var weights = tree.ClassWeights;
        var features = tree.Features;
        for (int node = 0; node < nodeCount; node++)
        {
            if (features[node] >= 0) continue;
            double total = 0;
            for (int c = 0; c < classCount; c++) total += weights[node * classCount + c];
            double squares = 0;
            for (int c = 0; c < classCount; c++)
            {
                double probability = total > 0 ? weights[node * classCount + c] / total : 1.0 / classCount;
                squares += probability * probability;
            }
            _nodeSquaredSum[node] = squares;
            _nodeWeight[node] = total;
        }
        int correct = 0;
        double brier = 0;
        for (int i = 0; i < _rowCount; i++)
        {
            int row = _rows[i];
            int leaf = tree.LeafOf(_matrix, row);
            if (tree.NodeClasses[leaf] == _classes[row]) correct++;
            brier += RowBrier(leaf, _classes[row]);
        }
        _baselineCorrect = correct;
        _baselineBrier = brier;
    }

    /// <summary>
    /// (accuracy drop, Brier increase) of the loaded tree when one feature's codes are permuted
    /// among its out-of-bag rows. Rows whose path never meets the feature keep their leaf, so an
    /// unused feature scores exactly 0.
    /// </summary>
    public (double AccuracyDrop, double BrierIncrease) ScoreFeature(int feature, ref Xoshiro256StarStar generator)
    {
        var tree = _tree!;
        if (_rowCount == 0) return (0, 0);
        Permute(ref generator);
        var codes = _matrix.Codes(feature);
        int correct = 0;
        double brier = 0;
        for (int i = 0; i < _rowCount; i++)
        {
            int row = _rows[i];
            int leaf = tree.LeafOf(_matrix, row, feature, codes[_permutedRows[i]]);
            if (tree.NodeClasses[leaf] == _classes[row]) correct++;
            brier += RowBrier(leaf, _classes[row]);
        }
        return ((double)(_baselineCorrect - correct) / _rowCount, (brier - _baselineBrier) / _rowCount);
    }

    /// <summary>
    /// Accuracy drop of the loaded tree when all members of a group take the codes of one shared
    /// permutation of the out-of-bag rows, which keeps their joint distribution (Strobl et al. 2008,
    /// BMC Bioinformatics 9:307).
    /// </summary>
    public double ScoreGroup(ReadOnlySpan<int> members, ref Xoshiro256StarStar generator)
    {
        if (_rowCount == 0) return 0;
        Permute(ref generator);
        foreach (int member in members) _inGroup[member] = true;
        int correct = 0;
        for (int i = 0; i < _rowCount; i++)
        {
            int row = _rows[i];
            int leaf = LeafWithGroupReplaced(row, _permutedRows[i]);
            if (_tree!.NodeClasses[leaf] == _classes[row]) correct++;
        }
        foreach (int member in members) _inGroup[member] = false;
        return (double)(_baselineCorrect - correct) / _rowCount;
    }

    /// <summary>Walks the tree reading group members' codes from the donor row and all others from the row itself.</summary>
    private int LeafWithGroupReplaced(int row, int donorRow)
    {
        var tree = _tree!;
        var features = tree.Features;
        var left = tree.LeftChildren;
        var right = tree.RightChildren;
        int node = 0;
        while (features[node] >= 0)
        {
            int feature = features[node];
            byte code = _matrix.Codes(feature)[_inGroup[feature] ? donorRow : row];
            node = tree.GoesLeft(node, code) ? left[node] : right[node];
        }
        return node;
    }

    /// <summary>Fills the donor rows: out-of-bag row i takes its permuted codes from row _rows[pi(i)].</summary>
    private void Permute(ref Xoshiro256StarStar generator)
    {
        var positions = _positions.AsSpan(0, _rowCount);
        for (int i = 0; i < positions.Length; i++) positions[i] = i;
        generator.Shuffle(positions);
        for (int i = 0; i < positions.Length; i++) _permutedRows[i] = _rows[positions[i]];
    }

    private double RowBrier(int leaf, int actualClass)
    {
        int classCount = _tree!.ClassCount;
        double total = _nodeWeight[leaf];
        double actual = total > 0 ? _tree.ClassWeights[leaf * classCount + actualClass] / total : 1.0 / classCount;
        return _nodeSquaredSum[leaf] - 2 * actual + 1;
    }
}
