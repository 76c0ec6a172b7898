using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public sealed class SpearmanTestTests
{
    [Fact]
    public void Rho_p_value_and_fisher_z_interval_match_scipy_and_bonett_wright()
    {
        // Source: stats_reference.json "spearman_test": scipy.stats.spearmanr for rho and p; the
        // interval of Bonett & Wright (2000) written out in numpy.
        int checkedSets = 0;
        foreach (var item in StatsReference.Block("spearman_test"))
        {
            var result = SpearmanTest.Test(item.Doubles("x"), item.Doubles("y"));
            Assert.Equal(item.Number("rho"), result.Rho, 1e-12);
            Assert.Equal(1, result.PValue / item.Number("p"), 1e-8);
            Assert.Equal(item.Number("lower"), result.Interval.Lower, 1e-12);
            Assert.Equal(item.Number("upper"), result.Interval.Upper, 1e-12);
            checkedSets++;
        }
        Assert.Equal(4, checkedSets);
    }

    [Fact]
    public void Missing_values_drop_their_pair_only()
    {
        // Common practice: pairwise-complete observations.
        double[] x = [1, 2, double.NaN, 4, 5, 6, 7];
        double[] y = [2, 1, 3, 4, double.NaN, 6, 8];
        var result = SpearmanTest.Test(x, y);
        Assert.Equal(5, result.Pairs);
        Assert.Equal(SpearmanTest.Test([1, 2, 4, 6, 7], [2, 1, 4, 6, 8]).Rho, result.Rho, 1e-15);
    }
}
