using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Effects;

namespace OmicsScreen.Screening.Tests.Effects;

/// <summary>Two-marker partial dependence (Friedman 2001, sec. 8.2) of a hand-built forest against hand computation.</summary>
public class PairPartialDependenceTests
{
    /// <summary>Four samples: f0 = 1, 2, 3, 4 and f1 = 10, 20, 10, 20 (each value its own bin).</summary>
    private static (FeatureMatrix Raw, BinnedMatrix Binned) TinyPanel()
    {
        var builder = new FeatureMatrixBuilder(["f0", "f1"], ["a", "b", "c", "d"]);
        float[] f0 = [1, 2, 3, 4], f1 = [10, 20, 10, 20];
        for (int s = 0; s < 4; s++) { builder.SetMeasured(0, s, f0[s]); builder.SetMeasured(1, s, f1[s]); }
        var raw = builder.Build();
        return (raw, new BinMapper().Bin(raw));
    }

    [Fact]
    public void An_xor_tree_gives_flat_single_curves_and_the_pattern_on_the_surface()
    {
        var (raw, binned) = TinyPanel();
        // One tree: f0 <= 2 (bin code 1)? then f1 <= 10 (code 0) gives 1, else 0; f0 > 2: f1 <= 10 gives 0, else 1.
        var routing = new UnmeasuredRouting[7];
        var tree = new TreeLeafValues(new SplitTopology([0, 1, 1, -1, -1, -1, -1], [1, 0, 0, 0, 0, 0, 0], [2.5f, 15, 15, 0, 0, 0, 0],
            [254, 254, 254, 0, 0, 0, 0], routing, [1, 3, 5, 0, 0, 0, 0], [2, 4, 6, 0, 0, 0, 0], [4, 2, 2, 1, 1, 1, 1]),
            [0, 0, 0, 1, 0, 0, 1]);
        var surface = PairPartialDependence.Compute([tree], raw, binned, 0, 1, threadCount: 1);
        Assert.Equal([1.0, 2, 3, 4], surface.FirstGrid);
        Assert.Equal([10.0, 20], surface.SecondGrid);
        // By hand: with both markers set, every sample gets the tree's value at (v0, v1), so the
        // surface is the tree itself: (1 or 2, 10) -> 1, (1 or 2, 20) -> 0, (3 or 4, 10) -> 0, (3 or 4, 20) -> 1.
        Assert.Equal([1.0, 0, 1, 0, 0, 1, 0, 1], surface.Average);
        Assert.Equal(1, surface.At(0, 0));
        // One marker alone: at v0 = 1 half the samples (f1 = 10) give 1 and half give 0, so 0.5 everywhere.
        var single = PartialDependence.Compute([tree], raw, binned, 0, threadCount: 1);
        Assert.Equal([0.5, 0.5, 0.5, 0.5], single.Average);
    }

    [Fact]
    public void Two_stumps_add_on_the_surface()
    {
        var (raw, binned) = TinyPanel();
        var routing = new UnmeasuredRouting[3];
        var onFirst = new TreeLeafValues(new SplitTopology([0, -1, -1], [1, 0, 0], [2.5f, 0, 0], [254, 0, 0], routing, [1, 0, 0], [2, 0, 0], [4, 2, 2]), [0, 0, 1]);
        var onSecond = new TreeLeafValues(new SplitTopology([1, -1, -1], [0, 0, 0], [15f, 0, 0], [254, 0, 0], routing, [1, 0, 0], [2, 0, 0], [4, 2, 2]), [0, 0.2, 0.6]);
        var surface = PairPartialDependence.Compute([onFirst, onSecond], raw, binned, 0, 1, threadCount: 2);
        // By hand: ([v0 > 2] + (v1 > 10 ? 0.6 : 0.2)) / 2.
        Assert.Equal([0.1, 0.3, 0.1, 0.3, 0.6, 0.8, 0.6, 0.8], surface.Average.Select(v => Math.Round(v, 12)));
    }
}
