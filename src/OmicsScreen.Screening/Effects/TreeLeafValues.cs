using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Effects;

/// <summary>
/// A grown tree seen as a prediction function: where a sample lands and what it is then predicted
/// to be (per node; only leaves are read). Lets partial dependence treat class, regression and
/// survival forests alike.
/// </summary>
public sealed record TreeLeafValues(SplitTopology Topology, double[] NodeValues)
{
    /// <summary>Class trees: 1 where the leaf votes for the positive class, else 0, so the forest's mean is its vote share.</summary>
    public static TreeLeafValues[] OfClassForest(Forest forest, int positiveClass)
    {
        ArgumentNullException.ThrowIfNull(forest);
        var trees = new TreeLeafValues[forest.TreeCount];
        for (int t = 0; t < trees.Length; t++)
        {
            var tree = forest.Tree(t);
            var classes = tree.NodeClasses;
            var values = new double[tree.NodeCount];
            for (int node = 0; node < values.Length; node++) values[node] = classes[node] == positiveClass ? 1 : 0;
            trees[t] = new TreeLeafValues(tree.Topology, values);
        }
        return trees;
    }

    /// <summary>Regression trees: the leaf mean.</summary>
    public static TreeLeafValues[] OfRegressionForest(RegressionForest forest)
    {
        ArgumentNullException.ThrowIfNull(forest);
        var trees = new TreeLeafValues[forest.TreeCount];
        for (int t = 0; t < trees.Length; t++) trees[t] = new TreeLeafValues(forest.Tree(t).Topology, forest.Tree(t).NodeMeans.ToArray());
        return trees;
    }

    /// <summary>Survival trees: the leaf's mortality (expected events, Ishwaran et al. 2008).</summary>
    public static TreeLeafValues[] OfSurvivalForest(SurvivalForest forest)
    {
        ArgumentNullException.ThrowIfNull(forest);
        var trees = new TreeLeafValues[forest.TreeCount];
        for (int t = 0; t < trees.Length; t++) trees[t] = new TreeLeafValues(forest.Tree(t).Topology, forest.Tree(t).Mortality.ToArray());
        return trees;
    }
}
