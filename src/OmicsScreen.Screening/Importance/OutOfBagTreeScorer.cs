using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Randomness;
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

    // Each out-of-bag row's unpermuted leaf, correctness and Brier score.
    private int[] _baseLeaf = [];
    private int[] _baseCorrect = [];
    private double[] _baseBrier = [];

    // The loaded tree's split features, each with a local index, and for each local feature the
    // out-of-bag rows (positions in _rows) whose path meets it, as one compressed list: rows
    // _visitRows[_visitStart[l] .. _visitStart[l + 1]) meet local feature l. Only those rows can
    // change leaf when that feature is permuted.
    private readonly int[] _localOfFeature;
    private int[] _treeFeatures = [];
    private int _treeFeatureCount;
    private int[] _visitStart = [];
    private int[] _visitRows = [];
    private int[] _rowStamp = [];
    private int[] _cursor = [];

    public OutOfBagTreeScorer(BinnedMatrix matrix, int[] classes)
    {
        _matrix = matrix;
        _classes = classes;
        _inGroup = new bool[matrix.FeatureCount];
        _localOfFeature = new int[matrix.FeatureCount];
        Array.Fill(_localOfFeature, -1);
    }

    /// <summary>The seed all of one tree's permutations derive from; a function of the forest and the tree only.</summary>
    public static ulong TreeSeed(Forest forest, int treeIndex) =>
        RandomStreams.PermutationImportanceTree(new ForestStreams(forest.Options.Seed, forest.Options.Repeat), forest.FirstTree + treeIndex);

    /// <summary>The generator permuting one feature in one tree.</summary>
    public static Xoshiro256StarStar FeatureGenerator(ulong treeSeed, int feature) =>
        RandomStreams.FeaturePermutation(treeSeed, feature);

    /// <summary>The generator permuting one group in one tree; repeat coordinate 1 keeps it apart from feature streams.</summary>
    public static Xoshiro256StarStar GroupGenerator(ulong treeSeed, int group) =>
        RandomStreams.GroupPermutation(treeSeed, group);

    public int RowCount => _rowCount;

    /// <summary>The loaded tree's out-of-bag rows; donor positions index into them.</summary>
    public ReadOnlySpan<int> Rows => _rows.AsSpan(0, _rowCount);

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
        if (_baseLeaf.Length < _rowCount)
        {
            _baseLeaf = new int[_rowCount];
            _baseCorrect = new int[_rowCount];
            _baseBrier = new double[_rowCount];
        }
        int correct = 0;
        double brier = 0;
        for (int i = 0; i < _rowCount; i++)
        {
            int row = _rows[i];
            int leaf = tree.LeafOf(_matrix, row);
            _baseLeaf[i] = leaf;
            _baseCorrect[i] = tree.NodeClasses[leaf] == _classes[row] ? 1 : 0;
            _baseBrier[i] = RowBrier(leaf, _classes[row]);
            correct += _baseCorrect[i];
            brier += _baseBrier[i];
        }
        _baselineCorrect = correct;
        _baselineBrier = brier;
        IndexRowsByFeature(tree);
    }

    /// <summary>Builds, for each split feature of the tree, the list of out-of-bag rows whose path meets it.</summary>
    private void IndexRowsByFeature(DecisionTree tree)
    {
        for (int k = 0; k < _treeFeatureCount; k++) _localOfFeature[_treeFeatures[k]] = -1;
        var features = tree.Features;
        int nodeCount = tree.NodeCount;
        if (_treeFeatures.Length < nodeCount) _treeFeatures = new int[nodeCount];
        _treeFeatureCount = 0;
        for (int node = 0; node < nodeCount; node++)
        {
            int feature = features[node];
            if (feature >= 0 && _localOfFeature[feature] < 0)
            {
                _localOfFeature[feature] = _treeFeatureCount;
                _treeFeatures[_treeFeatureCount++] = feature;
            }
        }
        int localCount = _treeFeatureCount;
        if (_visitStart.Length < localCount + 1) _visitStart = new int[localCount + 1];
        if (_rowStamp.Length < localCount) _rowStamp = new int[localCount];
        Array.Clear(_visitStart, 0, localCount + 1);
        Array.Clear(_rowStamp, 0, localCount);

        // Pass 1 counts each (row, feature) once, however often the path meets the feature;
        // pass 2 fills. A stamp per local feature (row position + 1, then + rowCount + 1) marks it seen.
        for (int i = 0; i < _rowCount; i++)
            foreach (int local in PathFeatures(tree, _rows[i], i + 1)) _visitStart[local + 1]++;
        for (int l = 0; l < localCount; l++) _visitStart[l + 1] += _visitStart[l];
        int total = _visitStart[localCount];
        if (_visitRows.Length < total) _visitRows = new int[total];
        if (_cursor.Length < localCount) _cursor = new int[localCount];
        Array.Copy(_visitStart, _cursor, localCount);
        for (int i = 0; i < _rowCount; i++)
            foreach (int local in PathFeatures(tree, _rows[i], _rowCount + i + 1)) _visitRows[_cursor[local]++] = i;
    }

    /// <summary>The local indices of the features on a row's path, each once (marked with <paramref name="stamp"/>).</summary>
    private PathFeatureEnumerator PathFeatures(DecisionTree tree, int row, int stamp) => new(this, tree, row, stamp);

    /// <summary>
    /// (accuracy drop, Brier increase) of the loaded tree when one feature's codes are permuted
    /// among its out-of-bag rows. Rows whose path never meets the feature keep their leaf, so an
    /// unused feature scores exactly 0.
    /// </summary>
    /// <remarks>
    /// Only the rows whose path meets the feature are walked again; the others keep their
    /// baseline leaf. The permutation is still drawn over all out-of-bag rows, so the result is
    /// that of <see cref="ScoreFeatureByFullWalk"/> (accuracy exactly; the Brier sum to rounding).
    /// </remarks>
    public (double AccuracyDrop, double BrierIncrease) ScoreFeature(int feature, ref Xoshiro256StarStar generator)
    {
        var tree = _tree!;
        if (_rowCount == 0) return (0, 0);
        int local = _localOfFeature[feature];
        if (local < 0) return (0, 0);
        Permute(ref generator);
        var codes = _matrix.Codes(feature);
        int correctChange = 0;
        double brierChange = 0;
        for (int k = _visitStart[local], end = _visitStart[local + 1]; k < end; k++)
        {
            int i = _visitRows[k];
            int row = _rows[i];
            int leaf = tree.LeafOf(_matrix, row, feature, codes[_permutedRows[i]]);
            if (leaf == _baseLeaf[i]) continue;
            correctChange += (tree.NodeClasses[leaf] == _classes[row] ? 1 : 0) - _baseCorrect[i];
            brierChange += RowBrier(leaf, _classes[row]) - _baseBrier[i];
        }
        return ((double)-correctChange / _rowCount, brierChange / _rowCount);
    }

    /// <summary>
    /// Brier increase of the loaded tree when out-of-bag row i reads the feature's code of
    /// out-of-bag row <paramref name="donors"/>[i] (positions in <see cref="Rows"/>), for a
    /// permutation the caller draws, such as one within strata of a covariate (Strobl et al. 2008,
    /// BMC Bioinformatics 9:307). Only rows whose path meets the feature are walked again, as in
    /// <see cref="ScoreFeature"/>.
    /// </summary>
    public double BrierIncreaseWithDonors(int feature, ReadOnlySpan<int> donors)
    {
        var tree = _tree!;
        if (_rowCount == 0) return 0;
        int local = _localOfFeature[feature];
        if (local < 0) return 0;
        var codes = _matrix.Codes(feature);
        double brierChange = 0;
        for (int k = _visitStart[local], end = _visitStart[local + 1]; k < end; k++)
        {
            int i = _visitRows[k];
            int row = _rows[i];
            int leaf = tree.LeafOf(_matrix, row, feature, codes[_rows[donors[i]]]);
            if (leaf == _baseLeaf[i]) continue;
            brierChange += RowBrier(leaf, _classes[row]) - _baseBrier[i];
        }
        return brierChange / _rowCount;
    }

    /// <summary>The plain reference of <see cref="ScoreFeature"/>: every out-of-bag row walked again.</summary>
    internal (double AccuracyDrop, double BrierIncrease) ScoreFeatureByFullWalk(int feature, ref Xoshiro256StarStar generator)
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

    /// <summary>Walks one row's path and yields each split feature's local index the first time the path meets it; no allocation.</summary>
    private struct PathFeatureEnumerator(OutOfBagTreeScorer scorer, DecisionTree tree, int row, int stamp)
    {
        private int _node;

        public readonly PathFeatureEnumerator GetEnumerator() => this;

        public int Current { get; private set; }

        public bool MoveNext()
        {
            var features = tree.Features;
            while (features[_node] >= 0)
            {
                int feature = features[_node];
                int local = scorer._localOfFeature[feature];
                byte code = scorer._matrix.Codes(feature)[row];
                _node = tree.GoesLeft(_node, code) ? tree.LeftChildren[_node] : tree.RightChildren[_node];
                if (scorer._rowStamp[local] == stamp) continue;
                scorer._rowStamp[local] = stamp;
                Current = local;
                return true;
            }
            return false;
        }
    }
}
