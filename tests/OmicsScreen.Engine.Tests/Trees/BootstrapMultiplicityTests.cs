using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Trees;

/// <summary>
/// How a bootstrap sample's repeated rows enter a tree (issue 15). In CART with case weights
/// (Breiman et al. 1984, ch. 4; scikit-learn passes bootstrap counts as sample_weight, ranger
/// replicates the rows) a row drawn k times counts k times in every class total: in the Gini
/// decrease that chooses a split and in a node's class proportions. A node whose distinct rows all
/// share one class is pure, whatever their counts.
/// </summary>
public class BootstrapMultiplicityTests
{
    private const int A = 0;
    private const int B = 1;

    private static BinnedMatrix OneFeature(params float[] values)
    {
        var builder = new FeatureMatrixBuilder(["x"], values.Select((_, i) => $"s{i}").ToArray());
        for (int s = 0; s < values.Length; s++) builder.SetMeasured(0, s, values[s]);
        return new BinMapper().Bin(builder.Build());
    }

    private static DecisionTree GrowOne(BinnedMatrix matrix, int[] rows, int[] classes, double[] weights)
    {
        var builder = new TreeBuilder(rows.Length, matrix.FeatureCount, matrix.MaxCodeCount, classCount: 2);
        var generator = new Xoshiro256StarStar(1);
        return builder.Grow(matrix, rows, classes, weights, TreeOptions.Default, ref generator);
    }

    [Fact]
    public void A_row_drawn_three_times_weighs_three_in_the_split_and_in_the_class_proportions()
    {
        // Worked by hand. In-bag rows (x, class, bootstrap count):
        //   (0,A,1) (1,A,1) (2,A,1) (3,B,1) (4,A,3) (5,B,1) (6,B,1); class weights A 6, B 3, W 9.
        // Gini proxy S_L/W_L + S_R/W_R of each cut (S = sum of squared class weights):
        //   x<=2: {A3} 9/3 + {A3,B3} 18/6           = 6.000
        //   x<=4: {A6,B1} 37/7 + {B2} 4/2           = 7.286  <- best with counts as weights
        //   x<=5: {A6,B2} 40/8 + {B1} 1/1           = 6.000   (others are lower still)
        // Counting each distinct row once instead: x<=2 gives 9/3 + 10/4 = 5.5 and x<=4 gives
        // 17/5 + 4/2 = 5.4, so a forest that ignored the counts would cut at x<=2.
        // Weighted Gini decrease (W_t G_t - W_L G_L - W_R G_R)/W = (9·4/9 - 7·12/49 - 0)/9 = 16/63.
        var matrix = OneFeature(0, 1, 2, 3, 4, 5, 6);
        int[] rows = [0, 1, 2, 3, 4, 5, 6];
        int[] classes = [A, A, A, B, A, B, B];
        double[] counts = [1, 1, 1, 1, 3, 1, 1];
        var tree = GrowOne(matrix, rows, classes, counts);

        Assert.Equal(0, tree.Features[0]);
        Assert.Equal(4, tree.BinThresholds[0]); // exact bins: code 4 is x = 4
        Assert.Equal(16.0 / 63.0, tree.ImpurityDecreases[0], 12);
        // The root's class weights are the counts summed (A 6, B 3); it holds 7 distinct rows.
        Assert.Equal([6.0, 3.0], tree.ClassWeights[..2].ToArray());
        Assert.Equal(7, tree.NodeSampleCounts[0]);

        // The leaf of x = 4 holds one distinct row of weight 3: its class proportion is 3 of 3.
        int leaf = tree.LeafOf(matrix, 4);
        Assert.Equal([3.0, 0.0], tree.ClassWeights.Slice(leaf * 2, 2).ToArray());
        Assert.Equal(1, tree.NodeSampleCounts[leaf]);
        // The right child {x=5, x=6}, both B, is pure and so a leaf; so is every leaf of a tree grown to purity.
        int right = tree.RightChildren[0];
        Assert.True(tree.IsLeaf(right));
        Assert.Equal([0.0, 2.0], tree.ClassWeights.Slice(right * 2, 2).ToArray());
        for (int node = 0; node < tree.NodeCount; node++)
            if (tree.IsLeaf(node)) Assert.True(tree.ClassWeights[node * 2] == 0 || tree.ClassWeights[node * 2 + 1] == 0);
    }

    [Fact]
    public void A_heavy_minority_row_wins_its_leaf_when_rows_cannot_be_separated()
    {
        // Two distinct rows with the same value cannot be split: the leaf's class is the heavier
        // one by weight (one A drawn three times against one B drawn once), as in a tree grown on
        // the rows replicated (common practice: majority of the leaf's in-bag cases).
        var matrix = OneFeature(1, 1);
        var tree = GrowOne(matrix, [0, 1], [B, A], [1, 3]);
        Assert.Equal(1, tree.NodeCount);
        Assert.Equal([3.0, 1.0], tree.ClassWeights.ToArray());
        Assert.Equal(A, tree.NodeClasses[0]);
    }

    [Theory]
    [InlineData(11UL, 2)]
    [InlineData(12UL, 3)]
    [InlineData(13UL, 2)]
    public void Counts_as_weights_grow_the_tree_that_replicated_rows_grow(ulong seed, int classCount)
    {
        // The definition of a bootstrap sample: a row drawn k times is k identical cases. Growing
        // on the distinct rows with counts as weights must give the splits, thresholds, weighted
        // class totals and decreases of the tree grown on the rows physically replicated (how
        // ranger and randomForest realise the bootstrap). Few distinct values keep both panels'
        // bins exact and identical.
        var generator = new Xoshiro256StarStar(seed);
        const int sampleCount = 60, featureCount = 6;
        var values = new float[featureCount, sampleCount];
        var classes = new int[sampleCount];
        var counts = new int[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            classes[s] = generator.NextInt(classCount);
            counts[s] = generator.NextInt(4); // 0..3 draws, as a bootstrap gives
            for (int f = 0; f < featureCount; f++) values[f, s] = generator.NextInt(8);
        }
        var distinctRows = Enumerable.Range(0, sampleCount).Where(s => counts[s] > 0).ToArray();
        var replicatedRows = distinctRows.SelectMany(s => Enumerable.Repeat(s, counts[s])).ToArray();

        var weighted = Grow(values, distinctRows, classes, distinctRows.Select(s => (double)counts[s]).ToArray(), classCount);
        var replicated = Grow(values, replicatedRows, classes, replicatedRows.Select(_ => 1.0).ToArray(), classCount);

        Assert.Equal(replicated.Features.ToArray(), weighted.Features.ToArray());
        Assert.Equal(replicated.BinThresholds.ToArray(), weighted.BinThresholds.ToArray());
        Assert.Equal(replicated.ClassWeights.ToArray(), weighted.ClassWeights.ToArray());
        Assert.Equal(replicated.NodeClasses.ToArray(), weighted.NodeClasses.ToArray());
        for (int node = 0; node < weighted.NodeCount; node++)
            Assert.Equal(replicated.ImpurityDecreases[node], weighted.ImpurityDecreases[node], 12);
    }

    /// <summary>Grows on a panel holding one sample per listed row (repeats become copies).</summary>
    private static DecisionTree Grow(float[,] values, int[] rows, int[] classes, double[] weights, int classCount)
    {
        int featureCount = values.GetLength(0);
        var builder = new FeatureMatrixBuilder(Enumerable.Range(0, featureCount).Select(f => $"f{f}").ToArray(),
            rows.Select((_, i) => $"s{i}").ToArray());
        for (int f = 0; f < featureCount; f++)
            for (int i = 0; i < rows.Length; i++) builder.SetMeasured(f, i, values[f, rows[i]]);
        var matrix = new BinMapper().Bin(builder.Build());
        var treeBuilder = new TreeBuilder(rows.Length, featureCount, matrix.MaxCodeCount, classCount);
        var generator = new Xoshiro256StarStar(5);
        var options = new TreeOptions { FeaturesPerSplit = featureCount };
        return treeBuilder.Grow(matrix, Enumerable.Range(0, rows.Length).ToArray(), rows.Select(r => classes[r]).ToArray(),
            weights, options, ref generator);
    }

    [Fact]
    public void A_forest_tree_is_grown_on_its_bootstrap_counts_and_votes_only_on_rows_drawn_zero_times()
    {
        // Ties the forest to the worked examples above: tree t's bootstrap counts, regenerated from
        // its sampling stream, are its weights, and its out-of-bag rows are exactly the rows drawn
        // zero times (Breiman 1996, "Out-of-bag estimation").
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 80, FeatureCount = 10, Seed = 3 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var options = new ForestOptions { TreeCount = 6, Seed = 21 };
        var forest = ForestTrainer.Train(binned, panel.Outcome, options);
        var classes = panel.Outcome.SampleClasses.ToArray();
        var plan = new SamplingPlan(options.Sampling, Enumerable.Range(0, 80).ToArray(), classes, 2);
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var counts = new int[80];
            var sampling = SeedSchedule.Generator(options.Seed, options.Repeat, t, SeedPurpose.Sampling);
            plan.Draw(ref sampling, counts, new int[plan.ScratchLength]);
            Assert.Equal(80, counts.Sum());
            var inBag = Enumerable.Range(0, 80).Where(s => counts[s] > 0).ToArray();
            Assert.Equal(Enumerable.Range(0, 80).Where(s => counts[s] == 0).ToArray(), forest.OutOfBag(t).Rows.ToArray());

            var builder = new TreeBuilder(80, 10, binned.MaxCodeCount, 2);
            var splitting = SeedSchedule.Generator(options.Seed, options.Repeat, t, SeedPurpose.Splitting);
            var expected = builder.Grow(binned, inBag, inBag.Select(s => classes[s]).ToArray(),
                inBag.Select(s => (double)counts[s]).ToArray(), options.Tree, ref splitting);
            Assert.Equal(expected.Features.ToArray(), forest.Tree(t).Features.ToArray());
            Assert.Equal(expected.BinThresholds.ToArray(), forest.Tree(t).BinThresholds.ToArray());
            Assert.Equal(expected.ClassWeights.ToArray(), forest.Tree(t).ClassWeights.ToArray());
            // The root's weight is the number of draws: the bootstrap draws n rows with replacement.
            Assert.Equal(80.0, forest.Tree(t).ClassWeights[0] + forest.Tree(t).ClassWeights[1]);
        }
    }

    [Fact]
    public void The_threshold_is_the_first_bin_boundary_above_the_left_side_so_values_in_the_gap_go_right()
    {
        // Worked example of threshold placement. Panel values 1..5 give exact bins with bounds
        // 1.5, 2.5, 3.5, 4.5, +inf (midpoints of adjacent distinct values). A node holds only
        // x = 1 (class A) and x = 5 (class B); x = 2, 3, 4 are out of bag. The split is "code <= 0",
        // stored as the real threshold 1.5: the bound just above the left side's largest value, not
        // the midpoint 3.0 of the node's two values that scikit-learn and ranger use. Out-of-bag
        // values inside the gap (2, 3, 4) therefore all go right. Measured for issue 15: placing
        // the cut in the middle bin of the gap instead changed the mean out-of-bag error over 10
        // seeds at 1,000 x 2,000 from 0.0658 to 0.0657, so the placement is kept, and with it the
        // invariance of every split to monotone transforms of a feature.
        var matrix = OneFeature(1, 2, 3, 4, 5);
        var tree = GrowOne(matrix, [0, 4], [A, B], [1, 1]);
        Assert.Equal(0, tree.BinThresholds[0]);
        Assert.Equal(1.5f, tree.Thresholds[0]);
        Assert.Equal(tree.LeftChildren[0], tree.LeafOf(matrix, 0));
        for (int s = 1; s < 5; s++) Assert.Equal(tree.RightChildren[0], tree.LeafOf(matrix, s));
        // Codes and raw values agree on the side of every panel value (FeatureBins' contract).
        for (int s = 0; s < 5; s++)
            Assert.Equal(matrix.Codes(0)[s] <= tree.BinThresholds[0], s + 1 <= tree.Thresholds[0]);
    }
}
