using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Resampling;

/// <summary>
/// The units that resampling draws, grouped into strata (<see cref="ResamplingStrata"/>): single samples, or whole
/// subjects when a subject grouping is given, so replicates or repeat visits of one person are
/// never split between a training part and its test part (Karpievitch et al. 2009).
/// </summary>
internal sealed class SamplingUnits
{
    private SamplingUnits(int[][][] strata) => Strata = strata;

    /// <summary>Strata[c][u] lists the panel rows of unit u of class stratum c, in ascending row order.</summary>
    public int[][][] Strata { get; }

    public int UnitCount => Strata.Sum(s => s.Length);

    /// <summary>
    /// Groups the eligible rows into units and strata. A subject's stratum is the stratum of most of
    /// its samples (ties to the lower code), which keeps folds balanced when a subject's
    /// samples share an outcome, the usual case.
    /// </summary>
    public static SamplingUnits Build(ResamplingStrata sampleStrata, SampleGrouping? subject, ReadOnlySpan<int> rows)
    {
        var classes = sampleStrata.SampleStrata;
        var strata = new List<int[]>[sampleStrata.StratumCount];
        for (int c = 0; c < strata.Length; c++) strata[c] = [];
        if (subject is null)
        {
            foreach (int row in rows) strata[classes[row]].Add([row]);
        }
        else
        {
            var levels = subject.SampleLevels;
            var bySubject = new SortedDictionary<int, List<int>>();
            foreach (int row in rows)
            {
                if (!bySubject.TryGetValue(levels[row], out var members)) bySubject[levels[row]] = members = [];
                members.Add(row);
            }
            var votes = new int[sampleStrata.StratumCount];
            foreach (var members in bySubject.Values)
            {
                Array.Clear(votes);
                foreach (int row in members) votes[classes[row]]++;
                int majority = 0;
                for (int c = 1; c < votes.Length; c++) if (votes[c] > votes[majority]) majority = c;
                members.Sort();
                strata[majority].Add(members.ToArray());
            }
        }
        return new SamplingUnits(strata.Select(s => s.ToArray()).ToArray());
    }
}
