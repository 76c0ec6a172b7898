using System.Diagnostics;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Forests;

/// <summary>The one call a command needs: bin a panel, grow a forest, summarise it, timing each stage.</summary>
public static class ForestGrower
{
    /// <summary>Grows on a whole panel; grouped sampling uses the options' groups, not the panel's subjects, so the caller decides.</summary>
    public static GrownForest Grow(Panel panel, ForestOptions options, BinMapper? binMapper = null)
    {
        ArgumentNullException.ThrowIfNull(panel);
        return Grow(panel.Matrix, panel.Outcome, options, binMapper);
    }

    public static GrownForest Grow(FeatureMatrix matrix, ClassOutcome outcome, ForestOptions options, BinMapper? binMapper = null)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(options);
        var watch = Stopwatch.StartNew();
        var binned = (binMapper ?? new BinMapper()).Bin(matrix, options.ThreadCount);
        var binningTime = watch.Elapsed;
        watch.Restart();
        var forest = ForestTrainer.Train(binned, outcome, options);
        var outOfBag = new OutOfBagVotes(forest, outcome);
        var trainingTime = watch.Elapsed;
        var importance = ImpurityImportance.From(forest);
        var result = new ForestResult(outOfBag.Error, outOfBag.PerClassError.ToArray(), outOfBag.Auc,
            outOfBag.ErrorCurve.ToArray(), importance.MeanDecrease.ToArray(), importance.NormalisedMeanDecrease.ToArray(),
            binningTime, trainingTime, options, options.Tree.ResolveFeaturesPerSplit(binned.FeatureCount));
        return new GrownForest(binned, forest, outOfBag, importance, result);
    }
}
