using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Importance;
using Xunit.Abstractions;

namespace OmicsScreen.Screening.Tests.Importance;

public class JanitzaNullTests(ITestOutputHelper output)
{
    [Fact]
    public void P_values_match_a_hand_computed_example_of_the_published_definition()
    {
        // Janitza, Celik & Boulesteix (2018), Section 3: null = negative importances, their
        // mirrors, and zeros. Importances {3, 1, 0, -1, -2, 0.5} give the null
        // {-1, 1, -2, 2, 0} = sorted {-2, -1, 0, 1, 2}; p(x) = #{null >= x} / 5 (worked by hand).
        double[] importances = [3, 1, 0, -1, -2, 0.5];
        var pValues = JanitzaNull.PValues(importances);
        Assert.Equal([0.0, 2 / 5.0, 3 / 5.0, 4 / 5.0, 5 / 5.0, 2 / 5.0], pValues);
    }

    [Fact]
    public void Zeros_enter_the_null_once_and_are_not_mirrored()
    {
        double[] importances = [0, 0, -1, 4];
        var nullSample = JanitzaNull.NullSample(importances);
        Array.Sort(nullSample);
        Assert.Equal([-1.0, 0, 0, 1], nullSample);
        // p(4) = 0/4; p(0) = #{0, 0, 1} / 4 (hand computed).
        Assert.Equal([0.75, 0.75, 1.0, 0.0], JanitzaNull.PValues(importances));
    }

    [Fact]
    public void No_non_positive_importance_gives_NaN_p_values()
    {
        var pValues = JanitzaNull.PValues([0.3, 0.1, 2.0]);
        Assert.All(pValues, p => Assert.True(double.IsNaN(p)));
    }

    [Fact]
    public void Other_values_are_scored_against_the_null_of_the_importances()
    {
        double[] importances = [3, 1, 0, -1, -2];
        // Null {-2, -1, 0, 1, 2}: p(1.5) = 1/5, p(-5) = 5/5, p(NaN) = NaN (hand computed).
        var pValues = JanitzaNull.PValues(importances, [1.5, -5, double.NaN]);
        Assert.Equal(0.2, pValues[0]);
        Assert.Equal(1.0, pValues[1]);
        Assert.True(double.IsNaN(pValues[2]));
    }

    [Fact]
    public void On_an_all_noise_panel_about_five_percent_of_p_values_fall_below_0_05()
    {
        // Janitza et al. (2018), simulation studies: under the global null the test keeps its
        // level. 300 noise features of corrected importance; loose bounds on the fraction.
        var (matrix, outcome) = ImportanceTestPanels.Binned(150, 300, 0, 0, seed: 31);
        var importance = CorrectedImpurityImportance.Measure(matrix, outcome, null, [], new ForestOptions { TreeCount = 200, Seed = 4 });
        var pValues = JanitzaNull.PValues(importance.Features);
        double below005 = pValues.Count(p => p < 0.05) / (double)pValues.Length;
        double belowHalf = pValues.Count(p => p < 0.5) / (double)pValues.Length;
        output.WriteLine($"fraction p < 0.05: {below005:F3}; p < 0.5: {belowHalf:F3}");
        Assert.InRange(below005, 0.01, 0.12);
        Assert.InRange(belowHalf, 0.35, 0.65);
    }
}
