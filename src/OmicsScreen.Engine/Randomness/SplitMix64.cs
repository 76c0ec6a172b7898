namespace OmicsScreen.Engine.Randomness;

/// <summary>
/// The SplitMix64 finaliser (Steele, Lea &amp; Flood 2014, "Fast splittable pseudorandom number
/// generators", OOPSLA), used to turn structured inputs such as (seed, repeat, tree) into
/// well-spread 64-bit seeds and to expand one seed into a generator's state.
/// </summary>
public static class SplitMix64
{
    /// <summary>The golden-ratio increment of the SplitMix64 sequence.</summary>
    public const ulong Increment = 0x9E3779B97F4A7C15UL;

    /// <summary>Mixes one 64-bit word; a bijection, so distinct inputs give distinct outputs.</summary>
    public static ulong Mix(ulong value)
    {
        value = (value ^ (value >> 30)) * 0xBF58476D1CE4E5B9UL;
        value = (value ^ (value >> 27)) * 0x94D049BB133111EBUL;
        return value ^ (value >> 31);
    }

    /// <summary>Advances a SplitMix64 state and returns its next output.</summary>
    public static ulong Next(ref ulong state)
    {
        state += Increment;
        return Mix(state);
    }
}
