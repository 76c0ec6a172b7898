using OmicsScreen.Engine.Forests;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Forests;

public class ForestGrowerTests
{
    [Fact]
    public void The_result_record_carries_every_summary_of_the_grown_forest()
    {
        var (matrix, outcome) = WdbcData.Load();
        var options = new ForestOptions { TreeCount = 100, Seed = 4 };
        var grown = ForestGrower.Grow(matrix, outcome, options);
        var result = grown.Result;
        Assert.Equal(grown.OutOfBag.Error, result.OutOfBagError);
        Assert.Equal(grown.OutOfBag.Auc, result.OutOfBagAuc);
        Assert.Equal(100, result.ErrorCurve.Count);
        Assert.Equal(2, result.PerClassError.Count);
        Assert.Equal(30, result.MeanDecreaseImpurity.Count);
        Assert.Equal(1.0, result.NormalisedDecreaseImpurity.Sum(), 12);
        Assert.Equal(5, result.FeaturesPerSplit); // floor(sqrt(30)), as rf_summary.json's max_features_resolved
        Assert.Same(options, result.Options);
        Assert.True(result.BinningTime > TimeSpan.Zero && result.TrainingTime > TimeSpan.Zero);
        // rf_summary.json: the reference forests' OOB accuracy ranges 0.956..0.967 over seeds.
        Assert.InRange(1 - result.OutOfBagError, 0.94, 0.98);
    }
}
