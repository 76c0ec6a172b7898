using OmicsScreen.Screening.Statistics;
using MathNetCorrelation = MathNet.Numerics.Statistics.Correlation;

namespace OmicsScreen.Screening.Tests.Statistics;

public class CorrelationTests
{
    [Fact]
    public void Spearman_matches_mathnet_on_data_with_many_ties()
    {
        // Reference library: MathNet.Numerics 5.0.0 Correlation.Spearman (average ranks for ties).
        var random = new Random(5);
        for (int trial = 0; trial < 20; trial++)
        {
            var x = Enumerable.Range(0, 80).Select(_ => (double)random.Next(6)).ToArray();
            var y = x.Select(v => v + random.Next(4)).ToArray();
            Assert.Equal(MathNetCorrelation.Spearman(x, y), Correlation.Spearman(x, y), 12);
        }
    }

    [Fact]
    public void Pearson_matches_mathnet()
    {
        // Reference library: MathNet.Numerics 5.0.0 Correlation.Pearson.
        var random = new Random(6);
        var x = Enumerable.Range(0, 200).Select(_ => random.NextDouble() * 10 + 1e6).ToArray();
        var y = x.Select(v => 2 * v + random.NextDouble()).ToArray();
        Assert.Equal(MathNetCorrelation.Pearson(x, y), Correlation.Pearson(x, y), 9);
    }

    [Fact]
    public void NaN_pairs_are_dropped_pairwise()
    {
        double[] x = [1, 2, double.NaN, 4, 5, 6];
        double[] y = [2, 1, 3, double.NaN, 5, 4];
        double[] keptX = [1, 2, 5, 6];
        double[] keptY = [2, 1, 5, 4];
        Assert.Equal(Correlation.Spearman(keptX, keptY), Correlation.Spearman(x, y), 15);
        Assert.Equal(Correlation.Pearson(keptX, keptY), Correlation.Pearson(x, y), 15);
        // By hand: ranks x (1, 2, 3, 4), y (2, 1, 4, 3); sum d^2 = 4, rho = 1 - 6*4 / (4 * 15) = 0.6.
        Assert.Equal(0.6, Correlation.Spearman(x, y), 14);
    }

    [Fact]
    public void Spearman_is_unchanged_by_a_monotone_transform()
    {
        var random = new Random(8);
        var x = Enumerable.Range(0, 50).Select(_ => random.NextDouble()).ToArray();
        var y = x.Select(v => v + 0.3 * random.NextDouble()).ToArray();
        Assert.Equal(Correlation.Spearman(x, y), Correlation.Spearman(x.Select(Math.Exp).ToArray(), y), 14);
    }

    [Fact]
    public void A_constant_variable_or_too_few_pairs_gives_NaN()
    {
        Assert.True(double.IsNaN(Correlation.Pearson([1.0, 1, 1], [1.0, 2, 3])));
        Assert.True(double.IsNaN(Correlation.Spearman([1.0, double.NaN], [1.0, 2])));
    }
}
