using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Forests;

public class ForestInvarianceTests
{
    private static FeatureMatrix Transform(FeatureMatrix matrix, Func<float[], float[]> transform)
    {
        var columns = new float[matrix.FeatureCount][];
        var states = new CellState[]?[matrix.FeatureCount];
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            columns[f] = transform(matrix.Column(f).ToArray());
            states[f] = matrix.HasUnmeasuredCells(f) ? matrix.States(f).ToArray() : null;
        }
        return new FeatureMatrix(matrix.FeatureNames, matrix.SampleIds, columns, states);
    }

    private static float[] Ranks(float[] values)
    {
        var ranks = RankCorrelation.MidRanks(values.Select(v => (double)v).ToArray());
        return values.Select((v, i) => float.IsNaN(v) ? float.NaN : (float)ranks[i]).ToArray();
    }

    public static TheoryData<string> Transforms => new() { "log", "cube", "rank" };

    [Theory]
    [MemberData(nameof(Transforms))]
    public void A_strictly_monotone_transform_of_every_feature_changes_nothing(string name)
    {
        // WDBC has both exact-binned features (< 255 distinct values) and quantile-binned ones.
        var (matrix, outcome) = WdbcData.Load();
        Func<float[], float[]> transform = name switch
        {
            "log" => v => v.Select(x => MathF.Log(x + 1f)).ToArray(),
            "cube" => v => v.Select(x => (x + 1f) * (x + 1f) * (x + 1f)).ToArray(),
            _ => Ranks,
        };
        var transformed = Transform(matrix, transform);
        var binned = new BinMapper().Bin(matrix);
        var binnedTransformed = new BinMapper().Bin(transformed);
        // Precondition: the transform kept every distinct value distinct in float32.
        for (int f = 0; f < matrix.FeatureCount; f++)
            Assert.Equal(binned.Bins(f).ValueBinCount, binnedTransformed.Bins(f).ValueBinCount);

        var options = new ForestOptions { TreeCount = 50, Seed = 3 };
        var forest = ForestTrainer.Train(binned, outcome, options);
        var forestTransformed = ForestTrainer.Train(binnedTransformed, outcome, options);
        // Common practice: trees use only the order of values, so the forests must be identical.
        ForestAssert.Identical(forest, forestTransformed);
        Assert.Equal(forest.Predict(matrix).Votes.ToArray(), forestTransformed.Predict(transformed).Votes.ToArray());
        Assert.Equal(new OutOfBagVotes(forest, outcome).Votes.ToArray(), new OutOfBagVotes(forestTransformed, outcome).Votes.ToArray());
    }

    private static Func<float[], float[]> Named(string name) => name switch
    {
        "log" => v => v.Select(x => MathF.Log(x + 100f)).ToArray(),
        "cube" => v => v.Select(x => (x + 100f) * (x + 100f) * (x + 100f)).ToArray(),
        _ => Ranks,
    };

    [Theory]
    [MemberData(nameof(Transforms))]
    public void Regression_forests_ignore_a_strictly_monotone_transform_of_every_feature(string name)
    {
        // Issue 17 asks for it; common practice: trees use only the order of values. Diabetes data
        // (Efron et al. 2004; reference/regression): every feature exactly binned except a few.
        var (matrix, y) = ReferenceTables.Measured("regression", "diabetes.csv");
        var transformed = Transform(matrix, Named(name));
        var (binned, binnedTransformed) = (new BinMapper().Bin(matrix), new BinMapper().Bin(transformed));
        for (int f = 0; f < matrix.FeatureCount; f++)
            Assert.Equal(binned.Bins(f).ValueBinCount, binnedTransformed.Bins(f).ValueBinCount);
        var options = new ForestOptions { TreeCount = 40, Seed = 5 };
        var forest = RegressionForestTrainer.Train(binned, y, options);
        var forestTransformed = RegressionForestTrainer.Train(binnedTransformed, y, options);
        Assert.Equal(forest.Predict(matrix), forestTransformed.Predict(transformed));
        Assert.Equal(new RegressionOutOfBag(forest, y).Predictions.ToArray(), new RegressionOutOfBag(forestTransformed, y).Predictions.ToArray());
        Assert.Equal(forest.MeanImpurityDecrease(), forestTransformed.MeanImpurityDecrease());
    }

    [Theory]
    [MemberData(nameof(Transforms))]
    public void Survival_forests_ignore_a_strictly_monotone_transform_of_every_feature(string name)
    {
        // Issue 18 (same binning and routing as class trees); common practice as above. R survival's
        // lung data (Loprinzi et al. 1994; reference/survival/lung_forest.csv).
        var (matrix, followUp) = SurvivalForestData.LoadLung();
        var transformed = Transform(matrix, Named(name));
        var (binned, binnedTransformed) = (new BinMapper().Bin(matrix), new BinMapper().Bin(transformed));
        for (int f = 0; f < matrix.FeatureCount; f++)
            Assert.Equal(binned.Bins(f).ValueBinCount, binnedTransformed.Bins(f).ValueBinCount);
        var options = new ForestOptions { TreeCount = 40, Seed = 5 };
        var forest = SurvivalForestTrainer.Train(binned, followUp, options);
        var forestTransformed = SurvivalForestTrainer.Train(binnedTransformed, followUp, options);
        for (int t = 0; t < forest.TreeCount; t++)
        {
            Assert.Equal(forest.Tree(t).Topology.Features.ToArray(), forestTransformed.Tree(t).Topology.Features.ToArray());
            Assert.Equal(forest.Tree(t).Mortality.ToArray(), forestTransformed.Tree(t).Mortality.ToArray());
            Assert.Equal(forest.OutOfBagMortality(t).ToArray(), forestTransformed.OutOfBagMortality(t).ToArray());
        }
    }
}
