using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Screen;

/// <summary>The memory estimate's terms, by hand for one shape, and its tree-size model against real forests.</summary>
public class MemoryEstimateTests
{
    private const long MiB = 1L << 20;

    /// <summary>100 samples x 1,000 features, 2 pairs, 10 trees, no decoys, no curve, one thread.</summary>
    private static readonly ScreenOptions Small = new() { HalfSamplePairs = 2, TreesPerForest = 10, DecoyCount = 0, CurveFolds = 0 };

    [Fact]
    public void Every_term_matches_the_hand_computed_bytes_of_a_small_screen()
    {
        // Arithmetic from the 64-bit .NET layout (common practice): array = 24-byte header + elements,
        // plus an 8-byte reference to it; object header 16; a 16-character name 24 + 32 + 3 references = 80.
        var estimate = MemoryEstimate.ForScreen(100, 1000, Small, threadCount: 1);

        // float32 columns 1000 x (24 + 400 + 8), state columns 1000 x (24 + 100 + 8), 1,100 names x 80.
        Assert.Equal(432_000 + 132_000 + 88_000, estimate.Bytes(MemoryComponent.RawMatrix));
        // codes 1000 x (24 + 100 + 8); bins 1000 x (16 + 8 + 24 + 4 x 100 bounds + 3 x 8 + 9).
        Assert.Equal(132_000 + 481_000, estimate.Bytes(MemoryComponent.BinnedCodes));
        // one contrast: 1000 x (100 + 100).
        Assert.Equal(200_000, estimate.Bytes(MemoryComponent.FeatureTables));
        // 100 rows: d = ceil(63.2) = 64 distinct, 64 nodes x 51 bytes + 376 per tree, 36 out-of-bag rows
        // 2 x (24 + 144) + 32, 16 in the forest's arrays: 4,024 bytes a tree, 10 trees.
        Assert.Equal(40_240, estimate.Bytes(MemoryComponent.ReferenceForest));
        // Two forests on 50 rows: d = 32, 32 nodes x 51 + 376, 18 out-of-bag rows 2 x (24 + 72) + 32, + 16: 2,248 a tree.
        Assert.Equal(2 * 22_480, estimate.Bytes(MemoryComponent.RepeatForests));
        // 1000 permuted-copy codes x 132, their names 1000 x (80 + 14), 2000 widened columns x (3 x 8 + 9).
        Assert.Equal(132_000 + 94_000 + 66_000, estimate.Bytes(MemoryComponent.PermutedCopyAndDecoyColumns));
        // Draw and row buffers 100 x 20 x 2, packed row increments 100 x 8, feature order 4 x 2000, histogram
        // 256 x 3 x 8, packed histogram 256 x 8 words + 256 x 8 running sums + 256 codes, node buffer 2 x 200 x 51.
        Assert.Equal(4_000 + 800 + 8_000 + 6_144 + 4_352 + 20_400, estimate.Bytes(MemoryComponent.TreesInFlight));
        // 4 repeats x 1000 features x (4 doubles + 1 bool).
        Assert.Equal(132_000, estimate.Bytes(MemoryComponent.RepeatImportances));
        Assert.Equal(0, estimate.Bytes(MemoryComponent.PanelSizeCurve));

        long live = 652_000 + 613_000 + 200_000 + 40_240 + 44_960 + 292_000 + 43_696 + 132_000;
        long headroom = (long)((MemoryEstimate.CollectorGrowth - 1) * live);
        Assert.Equal(headroom, estimate.Bytes(MemoryComponent.CollectorHeadroom));
        Assert.Equal(MemoryEstimate.RuntimeBaselineBytes + live + headroom, estimate.TotalBytes);
        Assert.Equal(0, estimate.Bytes(MemoryComponent.LoaderTransient));
    }

    [Fact]
    public void The_repeat_matrices_term_is_the_size_of_the_arrays_a_screen_keeps()
    {
        var options = Small with { HalfSamplePairs = 3, DecoyCount = 40 };
        var estimate = MemoryEstimate.ForScreen(100, 500, options, threadCount: 1);
        var kept = new RepeatImportances(6, 500, 40);

        long elements = (kept.Corrected.Length + kept.Permutation.Length + kept.Impurity.Length + kept.CombinedRank.Length
            + kept.DecoyCorrected.Length) * sizeof(double) + kept.Selected.Length + kept.DecoySelected.Length;
        Assert.Equal(elements, estimate.Bytes(MemoryComponent.RepeatImportances));
    }

    [Theory]
    [InlineData(100)]
    [InlineData(400)]
    public void Real_forests_stay_within_the_estimated_tree_size(int sampleCount)
    {
        // The model assumes d nodes for d distinct in-bag samples. Fully grown trees on a pure-noise panel
        // (the largest trees) must not exceed it, and should use a good part of it.
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = sampleCount, FeatureCount = 100, Null = true, Seed = 3 });
        var matrix = new BinMapper().Bin(panel.Matrix);
        var forest = ForestTrainer.Train(matrix, panel.Outcome, new ForestOptions { TreeCount = 20, Seed = 5 });
        long nodes = 0;
        foreach (var tree in forest.Enumerate()) nodes += tree.NodeCount;

        long assumedNodes = 20 * (long)Math.Ceiling(0.632 * sampleCount);
        Assert.True(nodes <= assumedNodes, $"{nodes} nodes exceed the {assumedNodes} assumed");
        Assert.True(nodes >= 0.3 * assumedNodes, $"{nodes} nodes, far below the {assumedNodes} assumed");
        Assert.True(nodes * (35 + 8 * 2) < MemoryEstimate.ForestBytes(sampleCount, 20, 2));
    }

    [Fact]
    public void Automatic_decoys_widen_the_corrected_forest_by_one_column_per_decoy_up_to_the_ceiling()
    {
        var automatic = Small with { DecoyCount = -1 };
        var below = MemoryEstimate.ForScreen(100, 5000, automatic, 1);
        var belowWithout = MemoryEstimate.ForScreen(100, 5000, automatic with { DecoyCount = 0 }, 1);
        var above = MemoryEstimate.ForScreen(100, 20000, automatic, 1);
        var aboveFixed = MemoryEstimate.ForScreen(100, 20000, automatic with { DecoyCount = 5000 }, 1);

        // One decoy per feature: 5000 more permuted-copy-like columns, as ScreenSettings resolves it.
        Assert.Equal(5000, ScreenSettings.DecoyCountFor(automatic, 5000));
        Assert.True(below.Bytes(MemoryComponent.PermutedCopyAndDecoyColumns) > belowWithout.Bytes(MemoryComponent.PermutedCopyAndDecoyColumns) * 3 / 2);
        // Past the ceiling the decoys stay at 5000.
        Assert.Equal(5000, ScreenSettings.DecoyCountFor(automatic, 20000));
        Assert.Equal(aboveFixed.TotalBytes, above.TotalBytes);
    }

    [Fact]
    public void Decoys_are_resolved_as_the_screen_resolves_them()
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { SampleCount = 40, FeatureCount = 120 });
        foreach (int decoys in new[] { -1, 0, 7 })
        {
            var options = new ScreenOptions { DecoyCount = decoys };
            Assert.Equal(ScreenSettings.Resolve(options, panel).DecoyCount, ScreenSettings.DecoyCountFor(options, panel.FeatureCount));
        }
        var few = new ScreenOptions { DecoyCount = -1, AutomaticDecoyFloor = 10, AutomaticDecoyCeiling = 100 };
        Assert.Equal(ScreenSettings.Resolve(few, panel).DecoyCount, ScreenSettings.DecoyCountFor(few, panel.FeatureCount));
    }

    [Fact]
    public void More_threads_add_only_tree_workers()
    {
        var one = MemoryEstimate.ForScreen(200, 2000, Small, 1);
        var eight = MemoryEstimate.ForScreen(200, 2000, Small, 8);

        Assert.Equal(8 * one.Bytes(MemoryComponent.TreesInFlight), eight.Bytes(MemoryComponent.TreesInFlight));
        Assert.Equal(one.Bytes(MemoryComponent.PermutedCopyAndDecoyColumns), eight.Bytes(MemoryComponent.PermutedCopyAndDecoyColumns));
        Assert.True(eight.TotalBytes > one.TotalBytes);
    }

    [Fact]
    public void A_reader_holding_many_copies_of_the_matrix_sets_the_peak_while_loading()
    {
        var estimate = MemoryEstimate.ForScreen(100, 1000, Small, 1, loaderMatrixCopies: 40);

        Assert.Equal(40 * 432_000, estimate.Bytes(MemoryComponent.LoaderTransient));
        Assert.Equal(0, estimate.Bytes(MemoryComponent.BinnedCodes));
        Assert.Equal(MemoryEstimate.RuntimeBaselineBytes + 652_000 + 40 * 432_000, estimate.TotalBytes);
    }

    [Fact]
    public void The_estimate_grows_with_samples_features_trees_and_repeats()
    {
        long Total(int samples, int features, ScreenOptions options) => MemoryEstimate.ForScreen(samples, features, options, 2).TotalBytes;
        var options = new ScreenOptions();
        long reference = Total(200, 2000, options);

        Assert.True(Total(400, 2000, options) > reference);
        Assert.True(Total(200, 4000, options) > reference);
        Assert.True(Total(200, 2000, options with { TreesPerForest = 1000 }) > reference);
        Assert.True(Total(200, 2000, options with { HalfSamplePairs = 50 }) > reference);
        // A 1,000 x 50,000 panel with the defaults needs well over a gigabyte, and a tiny one barely more than the runtime.
        Assert.True(Total(1000, 50_000, options) > 1024 * MiB);
        Assert.True(Total(20, 10, options) < MemoryEstimate.RuntimeBaselineBytes + 10 * MiB);
    }

    [Fact]
    public void Growing_one_forest_needs_less_than_screening()
    {
        var grow = MemoryEstimate.ForGrow(300, 3000, 500, 2);
        var screen = MemoryEstimate.ForScreen(300, 3000, new ScreenOptions(), 2);

        Assert.True(grow.TotalBytes < screen.TotalBytes);
        Assert.Equal(MemoryEstimate.ForestBytes(300, 500, 2), grow.Bytes(MemoryComponent.ReferenceForest));
        Assert.Equal(0, grow.Bytes(MemoryComponent.RepeatImportances));
    }

    [Fact]
    public void Largest_lists_the_biggest_terms_first_without_the_runtime()
    {
        var estimate = MemoryEstimate.ForScreen(200, 20_000, new ScreenOptions(), 2);
        var largest = estimate.Largest(3);

        Assert.Equal(3, largest.Count);
        Assert.DoesNotContain(largest, t => t.Component == MemoryComponent.RuntimeBaseline);
        Assert.True(largest[0].Bytes >= largest[1].Bytes && largest[1].Bytes >= largest[2].Bytes);
    }
}
