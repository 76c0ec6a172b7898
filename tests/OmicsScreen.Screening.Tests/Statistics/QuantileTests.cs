using OmicsScreen.Screening.Statistics;
using MathNetQuantile = MathNet.Numerics.Statistics.QuantileDefinition;
using MathNetStatistics = MathNet.Numerics.Statistics.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class QuantileTests
{
    [Theory]
    [InlineData(QuantileDefinition.InverseEmpiricalCdf, MathNetQuantile.R1)]
    [InlineData(QuantileDefinition.Weibull, MathNetQuantile.R6)]
    [InlineData(QuantileDefinition.Linear, MathNetQuantile.R7)]
    public void Quantiles_match_mathnet_for_the_same_hyndman_fan_type(QuantileDefinition ours, MathNetQuantile theirs)
    {
        // Reference library: MathNet.Numerics 5.0.0 Statistics.QuantileCustom with the same R type.
        double[] sorted = [0.5, 1, 1, 2.5, 4, 7, 7.5, 10, 12];
        foreach (double probability in new[] { 0.1, 0.25, 0.5, 0.75, 0.9 })
            Assert.Equal(MathNetStatistics.QuantileCustom(sorted, probability, theirs),
                Quantile.OfSorted(sorted, probability, ours), 12);
    }

    [Fact]
    public void Median_is_the_middle_value_or_the_mean_of_the_two_middle_values()
    {
        Assert.Equal(4, Quantile.MedianOfSorted([1.0, 4, 9]));
        Assert.Equal(6.5, Quantile.MedianOfSorted([1.0, 4, 9, 20]));
        Assert.True(double.IsNaN(Quantile.MedianOfSorted([])));
    }
}
