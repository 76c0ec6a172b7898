using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Importance;
using Xunit.Abstractions;

namespace OmicsScreen.Screening.Tests.Importance;

public class OutcomePermutationNullTests(ITestOutputHelper output)
{
    private const int Permutations = 19;

    [Fact]
    public void An_informative_feature_gets_the_smallest_possible_p_value_and_noise_does_not()
    {
        // Altmann et al. (2010), Bioinformatics 26(10): p = (1 + #{null >= observed}) / (1 + S);
        // with S = 19 the smallest p is 1/20, reached when no permuted outcome does as well.
        var (matrix, outcome) = ImportanceTestPanels.Binned(100, 10, 1, 2.0, seed: 51);
        var options = new ForestOptions { TreeCount = 100, Seed = 12 };
        var observed = CorrectedImpurityImportance.Measure(matrix, outcome, null, [], options).Features;
        var reported = new List<int>();
        var pValues = OutcomePermutationNull.PValues(matrix, outcome, null, observed, Permutations, options,
            new SynchronousProgress(reported.Add));
        output.WriteLine(string.Join(" ", pValues.Select(p => p.ToString("F2", System.Globalization.CultureInfo.InvariantCulture))));

        Assert.Equal(1.0 / (1 + Permutations), pValues[0]);
        double noiseMean = pValues[1..].Average();
        Assert.True(noiseMean > 0.25, $"noise p-values average {noiseMean:F3}");
        Assert.True(pValues[1..].Count(p => p == 1.0 / (1 + Permutations)) <= 2, "too many noise features reach the smallest p");
        Assert.All(pValues, p => Assert.InRange(p, 1.0 / (1 + Permutations), 1.0));
        Assert.Equal(Enumerable.Range(1, Permutations), reported);
    }

    [Fact]
    public void P_values_are_fixed_by_the_seed_and_not_by_the_thread_count()
    {
        var (matrix, outcome) = ImportanceTestPanels.Binned(80, 8, 1, 1.0, seed: 52);
        int[] trainingRows = Enumerable.Range(0, 80).Where(s => s % 5 != 0).ToArray();
        var one = new ForestOptions { TreeCount = 30, Seed = 3, ThreadCount = 1 };
        var observed = CorrectedImpurityImportance.Measure(matrix, outcome, trainingRows, [], one).Features;
        var first = OutcomePermutationNull.PValues(matrix, outcome, trainingRows, observed, 9, one);
        var again = OutcomePermutationNull.PValues(matrix, outcome, trainingRows, observed, 9, one);
        var twoThreads = OutcomePermutationNull.PValues(matrix, outcome, trainingRows, observed, 9, one with { ThreadCount = 2 });
        var otherSeed = OutcomePermutationNull.PValues(matrix, outcome, trainingRows, observed, 9, one with { Seed = 4 });
        Assert.Equal(first, again);
        Assert.Equal(first, twoThreads);
        Assert.NotEqual(first, otherSeed);
    }

    /// <summary>Reports on the calling thread, unlike <see cref="Progress{T}"/>, so the test sees every report before it checks.</summary>
    private sealed class SynchronousProgress(Action<int> report) : IProgress<int>
    {
        public void Report(int value) => report(value);
    }
}
