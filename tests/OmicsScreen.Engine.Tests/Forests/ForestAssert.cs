using OmicsScreen.Engine.Forests;

namespace OmicsScreen.Engine.Tests.Forests;

/// <summary>Compares two forests node by node and out-of-bag vote by vote.</summary>
internal static class ForestAssert
{
    public static void Identical(Forest expected, Forest actual)
    {
        Assert.Equal(expected.TreeCount, actual.TreeCount);
        Assert.Equal(expected.FirstTree, actual.FirstTree);
        for (int t = 0; t < expected.TreeCount; t++)
        {
            var a = expected.Tree(t);
            var b = actual.Tree(t);
            Assert.Equal(a.Features.ToArray(), b.Features.ToArray());
            Assert.Equal(a.BinThresholds.ToArray(), b.BinThresholds.ToArray());
            Assert.Equal(a.Routing.ToArray(), b.Routing.ToArray());
            Assert.Equal(a.LeftChildren.ToArray(), b.LeftChildren.ToArray());
            Assert.Equal(a.RightChildren.ToArray(), b.RightChildren.ToArray());
            Assert.Equal(a.ClassWeights.ToArray(), b.ClassWeights.ToArray());
            Assert.Equal(a.NodeClasses.ToArray(), b.NodeClasses.ToArray());
            Assert.Equal(a.ImpurityDecreases.ToArray(), b.ImpurityDecreases.ToArray());
            Assert.Equal(a.NodeSampleCounts.ToArray(), b.NodeSampleCounts.ToArray());
            Assert.Equal(expected.OutOfBag(t).Rows.ToArray(), actual.OutOfBag(t).Rows.ToArray());
            Assert.Equal(expected.OutOfBag(t).PredictedClasses.ToArray(), actual.OutOfBag(t).PredictedClasses.ToArray());
        }
    }
}
