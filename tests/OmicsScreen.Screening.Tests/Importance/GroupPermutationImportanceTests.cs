using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Importance;
using Xunit.Abstractions;

namespace OmicsScreen.Screening.Tests.Importance;

public class GroupPermutationImportanceTests(ITestOutputHelper output)
{
    [Fact]
    public void Two_identical_informative_copies_matter_more_together_than_either_alone()
    {
        // Strobl et al. (2008, BMC Bioinformatics 9:307) and Nicodemus et al. (2010, BMC
        // Bioinformatics 11:110): when one copy is permuted the trees still read the other, so
        // marginal permutation importance splits the signal; permuting both together does not.
        var (panel, outcome) = ImportanceTestPanels.Binned(200, 12, 1, 1.5, seed: 41);
        int[] columns = [0, 0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11];
        var matrix = panel.SelectFeatures(columns);
        var forest = ForestTrainer.Train(matrix, outcome, new ForestOptions { TreeCount = 300, Seed = 6 });

        var marginal = OutOfBagPermutationImportance.Measure(forest, matrix, outcome).MeanAccuracyDrop;
        var groups = OutOfBagPermutationImportance.MeasureGroups(forest, matrix, outcome, [[0, 1], [5, 6]]);
        output.WriteLine($"marginal {marginal[0]:F4}, {marginal[1]:F4}; group {groups[0]:F4}; noise group {groups[1]:F4}");

        Assert.True(groups[0] > marginal[0] + 0.02, $"group {groups[0]:F4} vs copy 1 {marginal[0]:F4}");
        Assert.True(groups[0] > marginal[1] + 0.02, $"group {groups[0]:F4} vs copy 2 {marginal[1]:F4}");
        Assert.InRange(groups[1], -0.01, 0.01);
    }

    [Fact]
    public void A_single_member_group_scores_like_its_feature_and_an_unused_group_scores_zero()
    {
        var (matrix, outcome) = ImportanceTestPanels.Binned(150, 10, 2, 1.5, seed: 42);
        var forest = ForestTrainer.Train(matrix, outcome, new ForestOptions { TreeCount = 400, Seed = 2 });
        var marginal = OutOfBagPermutationImportance.Measure(forest, matrix, outcome);
        var groups = OutOfBagPermutationImportance.MeasureGroups(forest, matrix, outcome, [[0], []]);
        // Same quantity, different permutations: agreement within a few standard errors (common practice).
        Assert.InRange(groups[0], marginal.MeanAccuracyDrop[0] - 4 * marginal.StandardError[0], marginal.MeanAccuracyDrop[0] + 4 * marginal.StandardError[0]);
        Assert.Equal(0.0, groups[1]);
    }
}
