using System.Numerics;

namespace OmicsScreen.Engine.Randomness;

/// <summary>
/// The xoshiro256** generator (Blackman &amp; Vigna 2021, "Scrambled linear pseudorandom number
/// generators", ACM TOMS 47(4)): 256 bits of state, period 2^256 - 1, no allocation. A mutable
/// struct: pass it by <c>ref</c>, never by value, or draws will repeat.
/// </summary>
/// <remarks>
/// Chosen over <see cref="System.Random"/> because its algorithm is published and fixed, so a
/// seed reproduces the same forest on every .NET version.
/// </remarks>
public struct Xoshiro256StarStar
{
    private ulong _s0, _s1, _s2, _s3;

    /// <summary>Expands one seed into the four state words with SplitMix64, as the authors advise.</summary>
    public Xoshiro256StarStar(ulong seed)
    {
        ulong state = seed;
        _s0 = SplitMix64.Next(ref state);
        _s1 = SplitMix64.Next(ref state);
        _s2 = SplitMix64.Next(ref state);
        _s3 = SplitMix64.Next(ref state);
    }

    /// <summary>Sets the raw state words; for checking against the published reference code.</summary>
    internal Xoshiro256StarStar(ulong s0, ulong s1, ulong s2, ulong s3)
    {
        _s0 = s0; _s1 = s1; _s2 = s2; _s3 = s3;
    }

    public ulong NextUInt64()
    {
        ulong result = BitOperations.RotateLeft(_s1 * 5, 7) * 9;
        ulong shifted = _s1 << 17;
        _s2 ^= _s0;
        _s3 ^= _s1;
        _s1 ^= _s2;
        _s0 ^= _s3;
        _s2 ^= shifted;
        _s3 = BitOperations.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>A uniform integer in [0, bound), bound &gt; 0, without modulo bias.</summary>
    /// <remarks>
    /// Lemire (2019), "Fast random integer generation in an interval", ACM TOMACS 29(1): take the
    /// high word of a 64x32-bit product and reject the few low words that would bias it.
    /// </remarks>
    public int NextInt(int bound)
    {
        if (bound <= 0) throw new ArgumentOutOfRangeException(nameof(bound));
        ulong product = (NextUInt64() >> 32) * (ulong)(uint)bound;
        uint low = (uint)product;
        if (low < (uint)bound)
        {
            uint threshold = (uint)(-bound) % (uint)bound;
            while (low < threshold)
            {
                product = (NextUInt64() >> 32) * (ulong)(uint)bound;
                low = (uint)product;
            }
        }
        return (int)(product >> 32);
    }

    /// <summary>A uniform double in [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));

    /// <summary>A standard normal draw (Box-Muller, polar-free form; one value per call).</summary>
    public double NextGaussian()
    {
        double u1 = 1.0 - NextDouble();
        double u2 = NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    /// <summary>Shuffles a span in place (Fisher-Yates; Knuth, TAOCP vol. 2, Algorithm P).</summary>
    public void Shuffle<T>(Span<T> items)
    {
        for (int i = items.Length - 1; i > 0; i--)
        {
            int j = NextInt(i + 1);
            (items[i], items[j]) = (items[j], items[i]);
        }
    }
}
