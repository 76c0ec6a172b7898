using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Corrected impurity importance, the "actual impurity reduction" (AIR) of Nembrini, König &amp;
/// Wright (2018, Bioinformatics 34(21):3711-3718): grow one forest on the real features, one
/// permuted copy of every real feature and any decoys, then AIR_j = MDI(j) - MDI(permuted copy j).
/// </summary>
/// <remarks>
/// A permuted copy has its feature's values, so it has the same chances to be picked and the same
/// number of candidate cut points, but no link to the outcome; subtracting its MDI removes the
/// bias of impurity importance toward features with many distinct values (Strobl et al. 2007,
/// BMC Bioinformatics 8:25). AIR of a noise feature is then centred on 0 and often negative,
/// which is what <see cref="JanitzaNull"/> uses. A decoy is a second, differently permuted copy
/// of a real feature, permuted once per run and scored the same way against its source's permuted
/// copy: a known-null feature whose statistics give the screen's null (<see cref="DecoyNull"/>). The forest is used for these importances only.
/// MDI is the engine's <see cref="ImpurityImportance.MeanDecrease"/>: per tree, the sum of
/// (W_t G_t - W_L G_L - W_R G_R)/W_root over the feature's splits, averaged over trees.
/// </remarks>
public static class CorrectedImpurityImportance
{
    /// <param name="matrix">The binned real features.</param>
    /// <param name="trainingRows">The rows the forest may use; null for all.</param>
    /// <param name="decoySources">The real features that each get one decoy; may be empty.</param>
    /// <param name="options">
    /// Trees, tree options, sampling, Seed, Repeat and ThreadCount of the forest. A null
    /// features-per-split resolves on the augmented width, floor(sqrt(columns)).
    /// </param>
    public static CorrectedImportance Measure(BinnedMatrix matrix, ClassOutcome outcome, int[]? trainingRows,
        ReadOnlySpan<int> decoySources, ForestOptions options)
    {
        ArgumentNullException.ThrowIfNull(outcome);
        return MeasureWith(matrix, decoySources, options,
            augmented => ImpurityImportance.From(ForestTrainer.Train(augmented, outcome, options, trainingRows)).MeanDecrease.ToArray());
    }

    /// <summary>
    /// The corrected importance of any outcome kind: grows a forest on <see cref="Augment"/>'s columns
    /// with importanceOf (which returns one impurity-type importance per column: Gini, variance or
    /// log-rank statistic) and reads AIR off it with <see cref="FromAugmented"/>.
    /// </summary>
    internal static CorrectedImportance MeasureWith(BinnedMatrix matrix, ReadOnlySpan<int> decoySources, ForestOptions options,
        Func<BinnedMatrix, double[]> importanceOf)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(options);
        int featureCount = matrix.FeatureCount;
        CheckDecoySources(decoySources, featureCount);
        var augmented = Augment(matrix, decoySources, options.Seed, options.Repeat, options.ThreadCount);
        return FromAugmented(importanceOf(augmented), featureCount, decoySources);
    }

    /// <summary>
    /// AIR from a forest grown on <see cref="Augment"/>'s columns: each real feature's importance
    /// minus its permuted copy's, each decoy's minus its source's permuted copy's. Any impurity-type
    /// importance works (Gini, variance, log-rank statistic).
    /// </summary>
    private static CorrectedImportance FromAugmented(ReadOnlySpan<double> importance, int featureCount, ReadOnlySpan<int> decoySources)
    {
        var features = new double[featureCount];
        for (int f = 0; f < featureCount; f++) features[f] = importance[f] - importance[featureCount + f];
        var decoys = new double[decoySources.Length];
        for (int i = 0; i < decoys.Length; i++)
            decoys[i] = importance[2 * featureCount + i] - importance[featureCount + decoySources[i]];
        return new CorrectedImportance(features, decoys, decoySources.ToArray());
    }

    /// <summary>Checks that every decoy source names a real feature.</summary>
    private static void CheckDecoySources(ReadOnlySpan<int> decoySources, int featureCount)
    {
        foreach (int source in decoySources)
            if ((uint)source >= (uint)featureCount) throw new ArgumentException($"Decoy source {source} is out of range.");
    }

    /// <summary>
    /// Columns [real 0..p-1, permuted copy of each real feature, one decoy per listed source]. The
    /// permuted copies are drawn afresh for each repeat: they only correct the bias of impurity
    /// importance. The decoys are permuted once per run, from <see cref="RandomStreams.DecoyPermutationSeed"/>
    /// (<see cref="DecoyPlan"/>), and every repeat reuses them: like a real null feature, a decoy then keeps
    /// its chance association with the outcome in every repeat, so its averaged importance and its
    /// selection frequency follow the law of a null feature's. Decoy i never reuses the permutation of copy i.
    /// </summary>
    internal static BinnedMatrix Augment(BinnedMatrix matrix, ReadOnlySpan<int> decoySources, ulong runSeed, int repeat, int threadCount = 0)
    {
        var allFeatures = new int[matrix.FeatureCount];
        for (int f = 0; f < allFeatures.Length; f++) allFeatures[f] = f;
        var withCopies = matrix.WithPermutedCopies(allFeatures, runSeed, repeat, threadCount);
        if (decoySources.IsEmpty) return withCopies;
        ulong decoySeed = RandomStreams.DecoyPermutationSeed(runSeed);
        return withCopies.WithPermutedCopies(decoySources, decoySeed, 0, threadCount);
    }
}
