using OmicsScreen.Screening.Importance;

namespace OmicsScreen.Screening.Tests.Importance;

public sealed class DecoyNullTests
{
    [Fact]
    public void Within_the_decoys_the_p_value_is_the_monte_carlo_share()
    {
        // p = (1 + #{decoys >= x}) / (1 + decoys): Davison & Hinkley (1997), eq. 4.11. 50 decoys,
        // too few for a tail fit.
        var decoys = Enumerable.Range(1, 50).Select(i => (double)i).ToArray();
        var p = DecoyNull.PValues(decoys, [25.5, 50, 0, 51]);
        Assert.Equal((1 + 25) / 51.0, p[0], 12);
        Assert.Equal((1 + 1) / 51.0, p[1], 12);
        Assert.Equal(1.0, p[2], 12);
        Assert.Equal(1 / 51.0, p[3], 12);
    }

    [Fact]
    public void Beyond_the_largest_decoys_the_fitted_tail_gives_smaller_p_values_that_keep_falling()
    {
        // 2,000 exponential decoys (the -ln of a uniform p-value): the tail is exponential with
        // scale 1, so P(X >= 12) is exp(-12) = 6.1e-6, far below the count's floor of 1/2001. The
        // p-value is the tail's 80% upper bound (GeneralizedParetoTailBound): at or above the truth,
        // and here, ten scales past the threshold, about 7 times it (the shape's uncertainty grows
        // with the square of the distance carried).
        var decoys = Enumerable.Range(0, 2000).Select(i => -Math.Log(1 - (i + 0.5) / 2000)).ToArray();
        var p = DecoyNull.PValues(decoys, [9, 12, 15]);
        Assert.True(p[0] > p[1] && p[1] > p[2]);
        Assert.InRange(p[1], Math.Exp(-12), Math.Exp(-12) * 10);
        Assert.True(p[0] < 1.0 / 2001);
    }

    [Fact]
    public void A_decoys_own_p_value_leaves_it_out_of_the_count()
    {
        var decoys = Enumerable.Range(1, 50).Select(i => (double)i).ToArray();
        var p = DecoyNull.DecoyPValues(decoys);
        // Decoy 40 has 10 others at or above it (41..50): (1 + 10) / (1 + 49).
        Assert.Equal(11 / 50.0, p[39], 12);
        Assert.Equal(1 / 50.0, p[49], 12);
    }
}
