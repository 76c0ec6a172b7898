using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
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
}
