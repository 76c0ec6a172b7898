namespace OmicsScreen.Engine.Randomness;

/// <summary>
/// Derives the seed of every random stream from (run seed, repeat, index, purpose) alone, so a
/// result never depends on thread count, scheduling or which batch a tree was grown in.
/// </summary>
/// <remarks>
/// Each coordinate is folded in with the SplitMix64 finaliser, a bijection of 64-bit words, so
/// streams of different coordinates start from unrelated states. The index is the tree index
/// for tree streams and the sample (or feature) index for per-sample (per-feature) streams.
/// </remarks>
public static class SeedSchedule
{
    public static ulong Derive(ulong runSeed, int repeat, int index, SeedPurpose purpose)
    {
        ulong state = SplitMix64.Mix(runSeed + SplitMix64.Increment);
        state = SplitMix64.Mix(state ^ (SplitMix64.Increment * (1UL + (uint)repeat)));
        // Purposes are below 256, so (index << 8) ^ purpose differs for every (index, purpose) pair.
        state = SplitMix64.Mix(state ^ ((ulong)(uint)index << 8) ^ (ulong)purpose);
        return state;
    }

    public static Xoshiro256StarStar Generator(ulong runSeed, int repeat, int index, SeedPurpose purpose) =>
        new(Derive(runSeed, repeat, index, purpose));
}
