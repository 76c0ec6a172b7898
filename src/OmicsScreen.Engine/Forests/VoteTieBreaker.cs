using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Engine.Forests;

/// <summary>
/// Random class priorities per sample, drawn from (seed, repeat, sample); a tied vote goes to
/// the tied class of highest priority. Never favours the first class, and a sample's tie is
/// broken the same way whatever the number of trees or the batch they came from.
/// </summary>
public sealed class VoteTieBreaker
{
    private readonly ulong[] _priorities;
    private readonly int _classCount;

    public VoteTieBreaker(ulong seed, int repeat, int sampleCount, int classCount)
    {
        _classCount = classCount;
        _priorities = new ulong[sampleCount * classCount];
        for (int s = 0; s < sampleCount; s++)
        {
            var generator = SeedSchedule.Generator(seed, repeat, s, SeedPurpose.VoteTieBreak);
            for (int c = 0; c < classCount; c++) _priorities[s * classCount + c] = generator.NextUInt64();
        }
    }

    /// <summary>True when candidate beats incumbent for this sample, given their vote counts.</summary>
    public bool Beats(int sample, int candidate, int candidateVotes, int incumbent, int incumbentVotes)
    {
        if (candidateVotes != incumbentVotes) return candidateVotes > incumbentVotes;
        return _priorities[sample * _classCount + candidate] > _priorities[sample * _classCount + incumbent];
    }

    /// <summary>The winning class of one sample's votes (ClassCount entries), or -1 when it has none.</summary>
    public int Winner(int sample, ReadOnlySpan<int> votes)
    {
        int best = 0, total = votes[0];
        for (int c = 1; c < votes.Length; c++)
        {
            total += votes[c];
            if (Beats(sample, c, votes[c], best, votes[best])) best = c;
        }
        return total > 0 ? best : -1;
    }
}
