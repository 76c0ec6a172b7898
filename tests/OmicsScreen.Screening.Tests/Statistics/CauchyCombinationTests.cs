using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public sealed class CauchyCombinationTests
{
    [Fact]
    public void Combined_p_values_match_scipys_cauchy_tail()
    {
        // Source: stats_reference.json "cauchy_combination" (scipy.stats.cauchy.sf of the mean of
        // tan((0.5 - p) pi), Liu & Xie 2020, JASA 115(529)).
        foreach (var item in StatsReference.Block("cauchy_combination"))
        {
            double expected = item.Number("p");
            double actual = CauchyCombination.Combine(item.Number("p1"), item.Number("p2"));
            Assert.True(Math.Abs(actual - expected) <= 1e-9 * expected + 1e-15,
                $"Combine({item.Number("p1")}, {item.Number("p2")}) = {actual:R}, scipy {expected:R}");
        }
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(0.01)]
    [InlineData(1e-20)]
    public void Two_equal_p_values_combine_to_the_same_p_value(double p)
    {
        // The average of two equal Cauchy variables is the same variable (Liu & Xie 2020).
        Assert.Equal(p, CauchyCombination.Combine(p, p), p * 1e-9);
    }

    [Fact]
    public void A_missing_p_value_leaves_the_other()
    {
        Assert.Equal(0.03, CauchyCombination.Combine(double.NaN, 0.03));
        Assert.Equal(0.2, CauchyCombination.Combine(0.2, double.NaN));
    }
}
