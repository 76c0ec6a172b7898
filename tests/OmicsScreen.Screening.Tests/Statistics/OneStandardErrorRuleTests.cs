using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class OneStandardErrorRuleTests
{
    private static readonly int[] Sizes = [1, 2, 3, 5, 8];

    [Fact]
    public void Chooses_the_smallest_size_within_one_se_of_the_best_auc()
    {
        // Best mean 0.86 at size 5 with SE 0.015: threshold 0.845; sizes 3, 5, 8 qualify; smallest is 3.
        int chosen = OneStandardErrorRule.Choose(Sizes, [0.70, 0.80, 0.85, 0.86, 0.855], [0.02, 0.02, 0.02, 0.015, 0.02],
            ScoreDirection.HigherIsBetter);
        Assert.Equal(2, chosen);
    }

    [Fact]
    public void Chooses_the_smallest_size_within_one_se_of_the_lowest_error()
    {
        // Best error 0.14 at size 5 with SE 0.015: threshold 0.155; sizes 3 (0.15), 5, 8 qualify.
        int chosen = OneStandardErrorRule.Choose(Sizes, [0.30, 0.20, 0.15, 0.14, 0.145], [0.02, 0.02, 0.02, 0.015, 0.02],
            ScoreDirection.LowerIsBetter);
        Assert.Equal(2, chosen);
    }

    [Fact]
    public void Zero_standard_error_chooses_the_best_and_NaN_means_are_skipped()
    {
        Assert.Equal(3, OneStandardErrorRule.Choose(Sizes, [0.7, double.NaN, 0.8, 0.9, 0.9], [0.0, 0, 0, 0, 0], ScoreDirection.HigherIsBetter));
        Assert.Equal(-1, OneStandardErrorRule.Choose([1], [double.NaN], [0.1], ScoreDirection.HigherIsBetter));
    }

    [Fact]
    public void Unsorted_sizes_still_give_the_smallest_qualifying_size()
    {
        int chosen = OneStandardErrorRule.Choose([8, 3, 5], [0.86, 0.85, 0.84], [0.02, 0.02, 0.02], ScoreDirection.HigherIsBetter);
        Assert.Equal(1, chosen);
    }
}
