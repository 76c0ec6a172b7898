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

    [Fact]
    public void Three_p_values_combine_as_scipys_cauchy_tail_of_their_mean()
    {
        // Source: stats_reference.json "cauchy_combination_three" (equal weights 1/3, scipy
        // cauchy.sf; Liu & Xie 2020).
        foreach (var item in StatsReference.Block("cauchy_combination_three"))
        {
            var p = item.Doubles("p");
            double expected = item.Number("combined");
            double actual = CauchyCombination.Combine(p);
            Assert.True(Math.Abs(actual - expected) <= 1e-9 * expected + 1e-15, $"Combine({string.Join(", ", p)}) = {actual:R}, scipy {expected:R}");
        }
        // NaN entries are left out: two of three equal the two-test combination.
        Assert.Equal(CauchyCombination.Combine(0.01, 0.3), CauchyCombination.Combine([0.01, double.NaN, 0.3]), 1e-15);
        // Weights: equal weights give the unweighted value, and weights are renormalised over the
        // p-values present (Liu & Xie 2020, weights summing to 1).
        foreach (var item in StatsReference.Block("cauchy_combination_three"))
        {
            var p = item.Doubles("p");
            Assert.Equal(item.Number("combined"), CauchyCombination.Combine(p, [2.0, 2.0, 2.0]), item.Number("combined") * 1e-9 + 1e-15);
        }
        Assert.Equal(CauchyCombination.Combine(0.01, 0.3), CauchyCombination.Combine([0.01, double.NaN, 0.3], [0.4, 0.2, 0.4]), 1e-15);
    }

    [Fact]
    public void Weighted_combination_matches_scipys_cauchy_tail_of_the_weighted_mean()
    {
        // Source: stats_reference.json "cauchy_combination_weighted" (weights 0.4, 0.4, 0.2; scipy cauchy.sf).
        foreach (var item in StatsReference.Block("cauchy_combination_weighted"))
        {
            var p = item.Doubles("p");
            double expected = item.Number("combined");
            double actual = CauchyCombination.Combine(p, item.Doubles("weights"));
            Assert.True(Math.Abs(actual - expected) <= 1e-9 * expected + 1e-15, $"Combine({string.Join(", ", p)}) = {actual:R}, scipy {expected:R}");
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
