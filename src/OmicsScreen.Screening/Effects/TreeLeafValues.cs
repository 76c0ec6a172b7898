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
    /// <summary>
    /// Class trees: the positive class's share of the node's (class-weighted) training samples, so
    /// the forest's mean is its probability of the positive class (leaf frequencies; a 0/1 vote
    /// would make every curve a count of trees).
    /// </summary>
    public static TreeLeafValues[] OfClassForest(Forest forest, int positiveClass)
    {
        ArgumentNullException.ThrowIfNull(forest);
        var trees = new TreeLeafValues[forest.TreeCount];
        for (int t = 0; t < trees.Length; t++)
        {
            var tree = forest.Tree(t);
            var weights = tree.ClassWeights;
            int classCount = tree.ClassCount;
            var values = new double[tree.NodeCount];
            for (int node = 0; node < values.Length; node++)
            {
                double total = 0;
                for (int c = 0; c < classCount; c++) total += weights[node * classCount + c];
                values[node] = total > 0 ? weights[node * classCount + positiveClass] / total : 0;
            }
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
