using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Importance;

/// <summary>
/// The decoys of one run: which real feature each copies and how its samples are permuted. Drawn
/// from the run seed alone, so every repeat grows the same decoys, and the permutation of a decoy's
/// raw values (for its rank test) is the one applied to its byte codes in the forests.
/// </summary>
public sealed record DecoyPlan(int[] Sources, ulong PermutationSeed)
{
    public int DecoyCount => Sources.Length;

    /// <summary>
    /// Every feature in turn when there are at least as many decoys as features, otherwise a uniform
    /// random subset; the permutations come from <see cref="RandomStreams.DecoyPermutationSeed"/>.
    /// </summary>
    public static DecoyPlan For(int featureCount, int decoyCount, ulong runSeed)
    {
        var sources = new int[decoyCount];
        if (decoyCount >= featureCount)
        {
            for (int d = 0; d < decoyCount; d++) sources[d] = d % featureCount;
        }
        else
        {
            var all = new int[featureCount];
            for (int f = 0; f < featureCount; f++) all[f] = f;
            var random = RandomStreams.DecoySources(runSeed);
            // Partial Fisher-Yates: the first decoyCount entries are a uniform random subset.
            for (int i = 0; i < decoyCount; i++)
            {
                int j = i + random.NextInt(featureCount - i);
                (all[i], all[j]) = (all[j], all[i]);
            }
            all.AsSpan(0, decoyCount).CopyTo(sources);
            Array.Sort(sources);
        }
        return new DecoyPlan(sources, RandomStreams.DecoyPermutationSeed(runSeed));
    }

    /// <summary>
    /// Where each sample of decoy <paramref name="decoy"/> takes its value from: decoy[s] =
    /// source[permutation[s]]. The same Fisher-Yates draws that shuffle the decoy's codes
    /// (<see cref="Engine.Binning.BinnedMatrix.WithPermutedCopies"/>, repeat 0, index = decoy),
    /// applied to the identity.
    /// </summary>
    public int[] Permutation(int decoy, int sampleCount)
    {
        var permutation = new int[sampleCount];
        for (int s = 0; s < sampleCount; s++) permutation[s] = s;
        RandomStreams.DecoyPermutation(PermutationSeed, decoy).Shuffle(permutation.AsSpan());
        return permutation;
    }

    /// <summary>The decoys' raw values: each source column permuted, missing and below-detection states with it.</summary>
    public FeatureMatrix Values(FeatureMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int sampleCount = matrix.SampleCount;
        var columns = new float[DecoyCount][];
        var states = new CellState[]?[DecoyCount];
        var names = new string[DecoyCount];
        for (int d = 0; d < DecoyCount; d++)
        {
            var permutation = Permutation(d, sampleCount);
            var source = matrix.Column(Sources[d]);
            var sourceStates = matrix.States(Sources[d]);
            var column = new float[sampleCount];
            CellState[]? state = sourceStates.IsEmpty ? null : new CellState[sampleCount];
            for (int s = 0; s < sampleCount; s++)
            {
                column[s] = source[permutation[s]];
                if (state is not null) state[s] = sourceStates[permutation[s]];
            }
            columns[d] = column;
            states[d] = state;
            names[d] = "decoy:" + matrix.FeatureNames[Sources[d]];
        }
        return new FeatureMatrix(names, matrix.SampleIds, columns, states);
    }
}
