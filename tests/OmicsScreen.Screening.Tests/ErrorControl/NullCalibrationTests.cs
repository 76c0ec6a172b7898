using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;
using Xunit.Abstractions;

namespace OmicsScreen.Screening.Tests.ErrorControl;

/// <summary>
/// On panels where no feature is related to the outcome, the screen's p-values are uniform and a
/// decoy's averaged importance follows the law of a null feature's: the two facts the shortlist's
/// false discovery rate rests on.
/// </summary>
public sealed class NullCalibrationTests(ITestOutputHelper output)
{
    private static ScreenOptions Small(ulong seed) => new()
    {
        Seed = seed,
        HalfSamplePairs = 5,
        TreesPerForest = 150,
        CurveFolds = 0,
        DecoyCount = 600,
    };

    private static (Panel Panel, ScreenResult Result) NullScreen(ulong seed, int samples = 80, int features = 200)
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design { Null = true, SampleCount = samples, FeatureCount = features, Seed = 500 + seed });
        return (panel, ScreenRunner.Run(panel, Small(seed)));
    }

    [Fact]
    public void P_values_of_null_features_are_uniform()
    {
        var pValues = new List<double>();
        for (ulong seed = 1; seed <= 4; seed++) pValues.AddRange(NullScreen(seed).Result.Features.Select(f => f.PValue));
        double distance = KolmogorovSmirnov.DistanceFromUniform(pValues);
        double critical = KolmogorovSmirnov.CriticalDistance(0.001, pValues.Count);
        double small = pValues.Count(p => p <= 0.05) / (double)pValues.Count;
        output.WriteLine($"KS distance {distance:0.000} (critical {critical:0.000} at 0.001), share p <= 0.05: {small:0.000}");
        // Kolmogorov-Smirnov against U(0,1) (critical value from Smirnov's asymptotic law).
        Assert.True(distance <= critical, $"KS distance {distance:0.000} above {critical:0.000}");
        // The share at or under 0.05 is 0.05 for a uniform p-value (common practice: the binomial
        // spread for 800 values is about 0.008, so 0.08 allows for the dependence within a run).
        Assert.InRange(small, 0.02, 0.08);
    }

    [Fact]
    public void A_decoys_averaged_importance_has_the_law_of_a_null_features()
    {
        var features = new List<double>();
        var decoys = new List<double>();
        for (ulong seed = 1; seed <= 3; seed++)
        {
            var (_, result) = NullScreen(10 + seed);
            features.AddRange(result.Features.Select(f => f.CorrectedMean));
            decoys.AddRange(ShortlistSelection.DecoyMeans(result.Repeats));
        }
        double distance = KolmogorovSmirnov.TwoSampleDistance(features, decoys);
        double critical = KolmogorovSmirnov.CriticalDistance(0.001, features.Count, decoys.Count);
        output.WriteLine($"two-sample KS distance {distance:0.000} (critical {critical:0.000} at 0.001)");
        // Two-sample Kolmogorov-Smirnov test (Smirnov's asymptotic critical value).
        Assert.True(distance <= critical, $"two-sample KS distance {distance:0.000} above {critical:0.000}");
    }
}
