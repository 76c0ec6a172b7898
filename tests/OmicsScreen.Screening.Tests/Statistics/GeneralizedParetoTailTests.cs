using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public sealed class GeneralizedParetoTailTests
{
    [Fact]
    public void Survival_matches_scipys_generalized_pareto()
    {
        // Source: stats_reference.json "generalized_pareto" (scipy.stats.genpareto.sf).
        foreach (var item in StatsReference.Block("generalized_pareto"))
        {
            var tail = new GeneralizedParetoTail(item.Number("scale"), item.Number("shape"));
            Assert.Equal(item.Number("survival"), tail.Survival(item.Number("y")), 12);
        }
    }

    [Theory]
    [InlineData(1.0, 0.3)]
    [InlineData(0.2, 0.6)]
    [InlineData(2.5, 0.1)]
    public void The_moment_fit_recovers_a_known_heavy_tail(double scale, double shape)
    {
        // The sample is the distribution's own quantiles at (i - 0.5)/n (inverse of the survival
        // function (1 + shape y/scale)^(-1/shape)), so the probability-weighted moments of
        // Hosking & Wallis (1987) should come back close to the true values.
        const int count = 4000;
        var sample = new double[count];
        for (int i = 0; i < count; i++)
        {
            double survival = 1 - (i + 0.5) / count;
            sample[i] = scale / shape * (Math.Pow(survival, -shape) - 1);
        }
        var fit = GeneralizedParetoTail.Fit(sample);
        Assert.Equal(shape, fit.Shape, 0.03);
        Assert.Equal(scale, fit.Scale, 0.03 * scale);
    }

    [Fact]
    public void A_light_tail_is_fitted_as_exponential_so_p_values_err_high()
    {
        // Uniform exceedances have a bounded tail (shape -1); the fit keeps shape 0 and the mean as
        // scale (the exponential with the same mean), whose survival is never 0.
        var sample = Enumerable.Range(0, 500).Select(i => (i + 0.5) / 500).ToArray();
        var fit = GeneralizedParetoTail.Fit(sample);
        Assert.Equal(0, fit.Shape);
        Assert.Equal(0.5, fit.Scale, 1e-9);
        Assert.True(fit.Survival(2) > 0);
    }
}
