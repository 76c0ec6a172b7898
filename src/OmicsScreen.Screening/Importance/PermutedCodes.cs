using OmicsScreen.Engine.Binning;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Importance;

/// <summary>One feature's codes of a tree's out-of-bag rows, shuffled among those rows (Fisher-Yates).</summary>
internal static class PermutedCodes
{
    /// <summary>Fills codes[i] with the feature's code of some out-of-bag row, a uniform permutation of rows' own codes.</summary>
    public static void Fill(BinnedMatrix matrix, int feature, ReadOnlySpan<int> rows, ulong treeSeed, Span<byte> codes)
    {
        var source = matrix.Codes(feature);
        for (int i = 0; i < rows.Length; i++) codes[i] = source[rows[i]];
        var generator = RandomStreams.FeaturePermutation(treeSeed, feature);
        for (int i = rows.Length - 1; i > 0; i--)
        {
            int j = generator.NextInt(i + 1);
            (codes[i], codes[j]) = (codes[j], codes[i]);
        }
    }
}
