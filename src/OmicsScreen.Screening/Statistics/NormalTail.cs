using MathNet.Numerics;

namespace OmicsScreen.Screening.Statistics;

/// <summary>Tail probabilities of the standard normal that stay accurate far into the tail.</summary>
/// <remarks>
/// 1 - Phi(z) computed as a difference loses every digit once Phi(z) rounds to 1 (z above about 8.3).
/// The complementary error function keeps full relative precision down to the smallest double:
/// P(Z &gt; z) = erfc(z / sqrt 2) / 2.
/// </remarks>
public static class NormalTail
{
    /// <summary>P(Z &gt; z) for a standard normal Z.</summary>
    public static double Upper(double z) => 0.5 * SpecialFunctions.Erfc(z / Constants.Sqrt2);

    /// <summary>P(|Z| &gt;= |z|) for a standard normal Z, at most 1.</summary>
    public static double TwoSided(double z) => Math.Min(1.0, SpecialFunctions.Erfc(Math.Abs(z) / Constants.Sqrt2));

    /// <summary>The quantile z with P(Z &lt;= z) = probability.</summary>
    public static double Quantile(double probability) =>
        -Constants.Sqrt2 * SpecialFunctions.ErfcInv(2.0 * probability);

    /// <summary>The multiplier of a two-sided interval at the given coverage, e.g. 1.959964 for 0.95.</summary>
    public static double TwoSidedCritical(double level)
    {
        if (!(level > 0 && level < 1)) throw new ArgumentOutOfRangeException(nameof(level), "The coverage must lie in (0, 1).");
        return Quantile(0.5 + 0.5 * level);
    }
}
