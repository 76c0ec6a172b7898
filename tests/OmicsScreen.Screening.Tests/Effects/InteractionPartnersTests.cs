using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Effects;

namespace OmicsScreen.Screening.Tests.Effects;

/// <summary>
/// The interaction-partner scan (issue 19, part 5) on simulations with known truth: an XOR pair
/// is named, unrelated markers on a null panel are not, markers acting on their own rarely are;
/// the adjacent-split counts of a hand-built forest computed by hand; the stratum-permuted copies
/// keep each stratum's values; the scan does not depend on the thread count.
/// </summary>
public class InteractionPartnersTests
{
    private const int Samples = 300, Features = 30;

    /// <summary>The designs simulated: an XOR pair (f0, f1) beside two additive markers, four additive markers, or no effect.</summary>
    public enum Design { XorPair, Additive, Null }

    /// <summary>
    /// 300 samples x 30 independent N(0, 1) features; class 1 with probability logistic(eta): XOR,
    /// eta = 2.5 sign(f0 f1) + f2 + f3 (f0 and f1 alone carry nothing: f0 is symmetric and
    /// independent of f1); additive, eta = f0 + f1 + f2 + f3; null, eta = 0.
    /// </summary>
    private static (FeatureMatrix Raw, ClassOutcome Outcome) Draw(ulong seed, Design design)
    {
        var generator = new Xoshiro256StarStar(seed);
        var builder = new FeatureMatrixBuilder(Enumerable.Range(0, Features).Select(i => $"f{i}").ToArray(),
            Enumerable.Range(0, Samples).Select(i => $"s{i}").ToArray());
        var classes = new int[Samples];
        var x = new double[Features];
        for (int s = 0; s < Samples; s++)
        {
            for (int f = 0; f < Features; f++) { x[f] = generator.NextGaussian(); builder.SetMeasured(f, s, (float)x[f]); }
            double eta = design switch
            {
                Design.XorPair => 2.5 * Math.Sign(x[0] * x[1]) + x[2] + x[3],
                Design.Additive => x[0] + x[1] + x[2] + x[3],
                _ => 0,
            };
            classes[s] = generator.NextDouble() < 1 / (1 + Math.Exp(-eta)) ? 1 : 0;
        }
        return (builder.Build(), new ClassOutcome("y", ["a", "b"], classes, 1));
    }

    private static InteractionPartnerScan Scan(ulong seed, Design design, int threads = 1)
    {
        var (raw, outcome) = Draw(seed, design);
        // The screen's defaults: 500 trees, floor(sqrt(30)) = 5 features per split, and the scan's
        // forest with TreeFactor times the trees.
        return InteractionPartners.Scan(raw, [0, 1, 2, 3, 4], outcome.SampleClasses, seed, featuresPerSplit: 5,
            (binned, featuresPerSplit) => TreeLeafValues.OfClassForest(ForestTrainer.Train(binned, outcome, new ForestOptions
            {
                TreeCount = InteractionPartners.TreeFactor * 500, Seed = seed, ThreadCount = threads,
                Tree = new TreeOptions { FeaturesPerSplit = featuresPerSplit },
            }), 1).Select(t => t.Topology).ToArray(), threads);
    }

    [Fact]
    public void An_xor_pair_is_named_as_partners_and_nothing_else_is()
    {
        // Known truth of the simulation: only f0 and f1 act together. Measured when the rule was
        // set: named in 9 of 10 seeds; we require 8.
        int named = 0, falselyNamed = 0;
        for (ulong seed = 1; seed <= 10; seed++)
        {
            var scan = Scan(seed, Design.XorPair);
            if (scan.Pairs.Single(p => p.First == 0 && p.Second == 1).Named) named++;
            falselyNamed += scan.Pairs.Count(p => p.Named && !(p.First == 0 && p.Second == 1));
            Assert.Equal(5 * 4 * InteractionPartners.CopiesPerMarker, scan.NullCount);
        }
        Assert.True(named >= 8, $"the XOR pair was named in {named} of 10 seeds");
        Assert.True(falselyNamed <= 1, $"{falselyNamed} pairs without an interaction were named");
    }

    [Fact]
    public void No_partner_is_named_among_unrelated_markers_on_a_null_panel_in_at_least_nine_of_ten_seeds()
    {
        // Issue 19's goal; the rule's bound (InteractionPartners remarks) is 1 / (2 x 10 + 1) per scan.
        int withPartner = 0;
        for (ulong seed = 1; seed <= 10; seed++)
            if (Scan(seed, Design.Null).Pairs.Any(p => p.Named)) withPartner++;
        Assert.True(withPartner <= 1, $"{withPartner} of 10 null panels named a partner");
    }

    [Fact]
    public void Markers_acting_on_their_own_are_rarely_named()
    {
        // Four additive markers: no pair acts together. The copies do not keep all of such a pair's
        // joint law (InteractionPartners remarks), so this is looser than the null: measured 2 of 10
        // seeds with a named pair when the rule was set; we require at most 3.
        int withPartner = 0;
        for (ulong seed = 1; seed <= 10; seed++)
            if (Scan(seed, Design.Additive).Pairs.Any(p => p.Named)) withPartner++;
        Assert.True(withPartner <= 3, $"{withPartner} of 10 additive panels named a partner");
    }

    [Fact]
    public void The_scan_does_not_depend_on_the_thread_count()
    {
        var one = Scan(3, Design.XorPair, threads: 1);
        var two = Scan(3, Design.XorPair, threads: 2);
        Assert.Equal(one.Pairs, two.Pairs);
        Assert.Equal(one.NullLargest, two.NullLargest);
    }

    [Fact]
    public void Copies_keep_every_stratum_s_values_and_shuffle_them()
    {
        var (raw, outcome) = Draw(4, Design.Additive);
        var strata = outcome.SampleClasses.ToArray();
        var extended = InteractionPartners.WithStratumCopies(raw, [2, 0], strata, 4, copiesPerMarker: 3);
        Assert.Equal(Features + 2 * 3, extended.FeatureCount);
        int moved = 0;
        for (int i = 0; i < 2; i++)
            for (int m = 0; m < 3; m++)
            {
                int source = i == 0 ? 2 : 0, copy = Features + i * 3 + m;
                for (int stratum = 0; stratum < 2; stratum++)
                {
                    var rows = Enumerable.Range(0, Samples).Where(s => strata[s] == stratum).ToArray();
                    // A permutation within the stratum: the same values, in another order.
                    Assert.Equal(rows.Select(s => raw.Value(source, s)).Order(), rows.Select(s => extended.Value(copy, s)).Order());
                    moved += rows.Count(s => raw.Value(source, s) != extended.Value(copy, s));
                }
            }
        Assert.True(moved > Samples, "the copies were hardly shuffled");
        for (int f = 0; f < Features; f++) Assert.Equal(raw.Column(f).ToArray(), extended.Column(f).ToArray());
    }

    /// <summary>A split node's arrays for a topology: features per node, bin thresholds, children.</summary>
    private static SplitTopology Tree(int[] features, int[] left, int[] right)
    {
        int n = features.Length;
        return new SplitTopology(features, new byte[n], new float[n], Enumerable.Repeat((byte)254, n).ToArray(),
            new UnmeasuredRouting[n], left, right, Enumerable.Repeat(10, n).ToArray());
    }

    [Fact]
    public void Adjacent_split_counts_of_a_hand_built_forest_equal_the_hand_count()
    {
        // Tree 1: root on f0, its left child on f1, the rest leaves. Tree 2: root on f1, left child
        // on f1, right child on f2. Parent-child pairs of split nodes: f0->f1, f1->f1, f1->f2 (3).
        var trees = new[]
        {
            Tree([0, 1, -1, -1, -1], [1, 3, 0, 0, 0], [2, 4, 0, 0, 0]),
            Tree([1, 1, 2, -1, -1, -1, -1], [1, 3, 5, 0, 0, 0, 0], [2, 4, 6, 0, 0, 0, 0]),
        };
        var splits = AdjacentSplits.Measure(trees, [0, 1, 2], 3);
        Assert.Equal(3, splits.EdgeCount);
        // By hand: parents f0 1, f1 2, f2 0; children f0 0, f1 2, f2 1.
        Assert.Equal([1.0, 2, 0], Enumerable.Range(0, 3).Select(splits.ParentCount));
        Assert.Equal([0.0, 2, 1], Enumerable.Range(0, 3).Select(splits.ChildCount));
        // {f0, f1}: observed 1, expected (1 x 2 + 2 x 0) / 3 = 2/3, score (1 - 2/3) / sqrt(2/3).
        Assert.Equal(1, splits.Observed(0, 1));
        Assert.Equal(2.0 / 3, splits.Expected(0, 1), 12);
        Assert.Equal((1 - 2.0 / 3) / Math.Sqrt(2.0 / 3), splits.Score(0, 1), 12);
        // {f1, f2}: observed 1, expected (2 x 1 + 0 x 2) / 3; {f0, f2}: observed 0, expected (1 x 1 + 0 x 0) / 3.
        Assert.Equal(2.0 / 3, splits.Expected(1, 2), 12);
        Assert.Equal(-(1.0 / 3) / Math.Sqrt(1.0 / 3), splits.Score(0, 2), 12);
        Assert.Equal(splits.Score(0, 1), splits.Score(1, 0), 12);
    }
}
