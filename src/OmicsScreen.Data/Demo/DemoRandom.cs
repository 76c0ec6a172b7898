using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Data.Demo;

/// <summary>
/// The engine's SplitMix64 sequence (Steele, Lea &amp; Flood 2014) with rejection-sampled integers
/// and Box-Muller normals: fully specified, so the demo files are byte-identical on every platform
/// and runtime version, unlike System.Random. Not the engine's Xoshiro256** generator on purpose:
/// the demo study's published files and truth table were drawn from this sequence, and a new
/// generator would redraw them.
/// </summary>
internal struct DemoRandom
{
    private ulong _state;
    private double _spareNormal;
    private bool _hasSpare;

    public DemoRandom(ulong seed)
    {
        _state = seed;
        _spareNormal = 0;
        _hasSpare = false;
    }

    public ulong NextUInt64() => SplitMix64.Next(ref _state);

    /// <summary>Uniform in [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));

    public double Uniform(double low, double high) => low + (high - low) * NextDouble();

    /// <summary>Uniform integer in [0, count) by rejection, so there is no modulo bias.</summary>
    public int NextInt(int count)
    {
        ulong bound = (ulong)count;
        ulong limit = ulong.MaxValue - ulong.MaxValue % bound;
        ulong draw;
        do { draw = NextUInt64(); } while (draw >= limit);
        return (int)(draw % bound);
    }

    public double Normal()
    {
        if (_hasSpare)
        {
            _hasSpare = false;
            return _spareNormal;
        }
        double u1;
        do { u1 = NextDouble(); } while (u1 <= double.Epsilon);
        double u2 = NextDouble();
        double radius = Math.Sqrt(-2.0 * Math.Log(u1));
        _spareNormal = radius * Math.Sin(2.0 * Math.PI * u2);
        _hasSpare = true;
        return radius * Math.Cos(2.0 * Math.PI * u2);
    }

    /// <summary>Fisher-Yates shuffle in place.</summary>
    public void Shuffle<T>(Span<T> items)
    {
        for (int i = items.Length - 1; i > 0; i--)
        {
            int j = NextInt(i + 1);
            (items[i], items[j]) = (items[j], items[i]);
        }
    }
}
