using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Outcome-permutation p-values for corrected impurity importance (Altmann, Toloşi, Sander &amp;
/// Lengauer 2010, Bioinformatics 26(10):1340-1347): permute the outcome among the training rows S
/// times, recompute the importance of every feature on each permuted outcome, and compare.
/// </summary>
/// <remarks>
/// p_j = (1 + #{s : null_sj &gt;= observed_j}) / (1 + S), which counts the observed data as one of
/// the permutations so that p is never 0 and is valid at any S (Phipson &amp; Smyth 2010, Stat Appl
/// Genet Mol Biol 9(1):39). The smallest possible p is 1/(1 + S).
/// Permutation s uses the seed Derive(options.Seed, options.Repeat, s, OutcomePermutation): its
/// label shuffle comes from the generator of that seed at (0, 0, OutcomePermutation) and its forest
/// is grown with that seed as run seed, so each permutation is reproducible on its own and
/// independent of the thread count.
/// </remarks>
public static class OutcomePermutationNull
{
    /// <param name="observed">The corrected importance of each feature on the real outcome, with the same options.</param>
    /// <param name="permutations">S, the number of outcome permutations (at least 1).</param>
    /// <param name="progress">Told the number of permutations finished after each one.</param>
    public static double[] PValues(BinnedMatrix matrix, ClassOutcome outcome, int[]? trainingRows,
        ReadOnlySpan<double> observed, int permutations, ForestOptions options, IProgress<int>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(outcome);
        ArgumentNullException.ThrowIfNull(options);
        if (observed.Length != matrix.FeatureCount) throw new ArgumentException("One observed importance per feature is needed.");
        if (permutations < 1) throw new ArgumentOutOfRangeException(nameof(permutations), "At least one permutation is needed.");
        if (outcome.SampleCount != matrix.SampleCount) throw new ArgumentException("The outcome must have one class per sample.");

        int[] rows = trainingRows ?? Enumerable.Range(0, matrix.SampleCount).ToArray();
        var atLeastObserved = new int[matrix.FeatureCount];
        var rowClasses = new int[rows.Length];
        for (int s = 0; s < permutations; s++)
        {
            ulong permutationSeed = RandomStreams.OutcomePermutationSeed(new ForestStreams(options.Seed, options.Repeat), s);
            var permuted = PermuteOutcome(outcome, rows, rowClasses, permutationSeed);
            var nullImportance = CorrectedImpurityImportance.Measure(matrix, permuted, trainingRows, [],
                options with { Seed = permutationSeed }).Features;
            for (int f = 0; f < atLeastObserved.Length; f++)
                if (nullImportance[f] >= observed[f]) atLeastObserved[f]++;
            progress?.Report(s + 1);
        }
        var pValues = new double[matrix.FeatureCount];
        for (int f = 0; f < pValues.Length; f++)
            pValues[f] = double.IsNaN(observed[f]) ? double.NaN : (1.0 + atLeastObserved[f]) / (1.0 + permutations);
        return pValues;
    }

    /// <summary>The outcome with the classes of the training rows shuffled among those rows; other rows keep theirs.</summary>
    private static ClassOutcome PermuteOutcome(ClassOutcome outcome, int[] rows, int[] rowClasses, ulong permutationSeed)
    {
        var classes = outcome.SampleClasses.ToArray();
        for (int i = 0; i < rows.Length; i++) rowClasses[i] = classes[rows[i]];
        var generator = RandomStreams.OutcomeShuffle(permutationSeed);
        generator.Shuffle(rowClasses.AsSpan());
        for (int i = 0; i < rows.Length; i++) classes[rows[i]] = rowClasses[i];
        return new ClassOutcome(outcome.ColumnName, outcome.ClassNames, classes, outcome.PositiveClass);
    }
}
