using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Resampling;

/// <summary>
/// Complementary pairs of half-samples (Shah &amp; Samworth 2013, JRSS-B 75(1)): each pair splits
/// the eligible units into two disjoint halves, stratified (by class, or the strata of
/// another outcome kind: <see cref="ResamplingStrata"/>), so every unit is used by
/// exactly one member of each pair. The pairs are what the stability bounds assume.
/// </summary>
public static class HalfSamplePairs
{
    /// <summary>
    /// Draws <paramref name="pairCount"/> pairs; element 2i and 2i+1 of the result are the two
    /// halves of pair i, as ascending panel row indices. Pair i depends on (runSeed, i) only.
    /// </summary>
    public static int[][] Draw(ClassOutcome outcome, SampleGrouping? subject, ReadOnlySpan<int> eligibleRows,
        int pairCount, ulong runSeed) =>
        Draw(ResamplingStrata.Of(outcome), subject, eligibleRows, pairCount, runSeed);

    /// <summary>As above, with the halves balanced over any outcome kind's strata.</summary>
    public static int[][] Draw(ResamplingStrata strata, SampleGrouping? subject, ReadOnlySpan<int> eligibleRows,
        int pairCount, ulong runSeed)
    {
        ArgumentNullException.ThrowIfNull(strata);
        ArgumentOutOfRangeException.ThrowIfLessThan(pairCount, 1);
        var units = SamplingUnits.Build(strata, subject, eligibleRows);
        var halves = new int[2 * pairCount][];
        var first = new List<int>();
        var second = new List<int>();
        for (int pair = 0; pair < pairCount; pair++)
        {
            var random = RandomStreams.HalfSamples(runSeed, pair);
            first.Clear();
            second.Clear();
            // Which half gets the odd unit of a stratum alternates from a random start, so the
            // halves differ in size by at most one unit overall.
            bool oddToFirst = random.NextInt(2) == 0;
            foreach (var stratum in units.Strata)
            {
                var order = ShuffledIndices(stratum.Length, ref random);
                int firstCount = stratum.Length / 2 + (stratum.Length % 2 == 1 && oddToFirst ? 1 : 0);
                if (stratum.Length % 2 == 1) oddToFirst = !oddToFirst;
                for (int i = 0; i < order.Length; i++)
                    (i < firstCount ? first : second).AddRange(stratum[order[i]]);
            }
            first.Sort();
            second.Sort();
            halves[2 * pair] = first.ToArray();
            halves[2 * pair + 1] = second.ToArray();
        }
        return halves;
    }

    internal static int[] ShuffledIndices(int count, ref Xoshiro256StarStar random)
    {
        var order = new int[count];
        for (int i = 0; i < count; i++) order[i] = i;
        random.Shuffle(order.AsSpan());
        return order;
    }
}
