using System.Text.Json;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Statistics;

/// <summary>Kruskal-Wallis H, its p-value and epsilon-squared, and Spearman's rho and p, against scipy (reference/covariates).</summary>
public class CovariateStatisticsTests
{
    private static readonly Lazy<JsonDocument> Reference = new(() =>
        JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "covariates", "covariate_reference.json"))));

    [Fact]
    public void Kruskal_wallis_matches_scipy_on_shifted_tied_and_null_samples()
    {
        int checkedBlocks = 0;
        foreach (var block in Reference.Value.RootElement.GetProperty("kruskal_wallis").EnumerateArray())
        {
            var values = block.Doubles("values");
            var levels = block.Doubles("levels").Select(l => (int)l).ToArray();
            var result = KruskalWallisTest.Test(values, levels, block.GetProperty("level_count").GetInt32());
            // Source: covariate_reference.json, scipy.stats.kruskal 1.10.1 (tie-corrected H, chi-square p).
            Assert.Equal(block.Number("h"), result.H, 1e-9);
            Assert.Equal(block.Number("p"), result.PValue, 1e-9);
            // Source: epsilon-squared = H / ((n^2 - 1) / (n + 1)), Tomczak & Tomczak (2014), computed from scipy's H.
            Assert.Equal(block.Number("epsilon_squared"), result.EpsilonSquared, 1e-9);
            checkedBlocks++;
        }
        Assert.Equal(3, checkedBlocks);
    }

    [Fact]
    public void Spearman_matches_scipy_with_and_without_ties()
    {
        int checkedBlocks = 0;
        foreach (var block in Reference.Value.RootElement.GetProperty("spearman").EnumerateArray())
        {
            var result = SpearmanTest.Test(block.Doubles("x"), block.Doubles("y"));
            // Source: covariate_reference.json, scipy.stats.spearmanr 1.10.1.
            Assert.Equal(block.Number("rho"), result.Rho, 1e-9);
            Assert.Equal(block.Number("p"), result.PValue, 1e-7);
            checkedBlocks++;
        }
        Assert.Equal(2, checkedBlocks);
    }

    [Fact]
    public void Kruskal_wallis_needs_two_levels_with_samples()
    {
        var result = KruskalWallisTest.Test([1.0, 2.0, 3.0], [1, 1, 1], 2);
        Assert.True(double.IsNaN(result.H));
    }
}
