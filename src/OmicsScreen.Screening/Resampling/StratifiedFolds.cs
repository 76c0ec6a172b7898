using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Resampling;

/// <summary>
/// Repeated K-fold splits, stratified (by class, or another outcome kind's strata) and grouped by subject, for the outer loop of an
/// selection-aware estimate: each fold's test part is never seen by the screen that is scored on it
/// (Ambroise &amp; McLachlan 2002, PNAS 99(10)).
/// </summary>
public static class StratifiedFolds
{
    public static IReadOnlyList<OuterFold> Draw(ClassOutcome outcome, SampleGrouping? subject, ReadOnlySpan<int> eligibleRows,
        int foldCount, int repeatCount, ulong runSeed) =>
        Draw(ResamplingStrata.Of(outcome), subject, eligibleRows, foldCount, repeatCount, runSeed);

    /// <summary>As above, stratified by any outcome kind's strata.</summary>
    public static IReadOnlyList<OuterFold> Draw(ResamplingStrata strata, SampleGrouping? subject, ReadOnlySpan<int> eligibleRows,
        int foldCount, int repeatCount, ulong runSeed)
    {
        ArgumentNullException.ThrowIfNull(strata);
        ArgumentOutOfRangeException.ThrowIfLessThan(foldCount, 2);
        ArgumentOutOfRangeException.ThrowIfLessThan(repeatCount, 1);
        var units = SamplingUnits.Build(strata, subject, eligibleRows);
        if (units.UnitCount < foldCount)
            throw new ArgumentException($"{foldCount} folds need at least {foldCount} samples (or subjects); there are {units.UnitCount}.");
        var folds = new List<OuterFold>(foldCount * repeatCount);
        var members = new List<int>[foldCount];
        for (int repeat = 0; repeat < repeatCount; repeat++)
        {
            var random = RandomStreams.OuterFolds(runSeed, repeat);
            for (int f = 0; f < foldCount; f++) members[f] = [];
            // Deal each stratum's shuffled units round-robin, continuing where the previous
            // stratum stopped, so fold sizes differ by at most one unit.
            int next = random.NextInt(foldCount);
            foreach (var stratum in units.Strata)
            {
                var order = HalfSamplePairs.ShuffledIndices(stratum.Length, ref random);
                foreach (int u in order)
                {
                    members[next].AddRange(stratum[u]);
                    next = (next + 1) % foldCount;
                }
            }
            for (int f = 0; f < foldCount; f++)
            {
                var test = members[f].Order().ToArray();
                var training = new List<int>();
                for (int g = 0; g < foldCount; g++) if (g != f) training.AddRange(members[g]);
                training.Sort();
                folds.Add(new OuterFold(repeat, f, training.ToArray(), test));
            }
        }
        return folds;
    }
}
