using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport;

/// <summary>
/// Invented features for outcome-kind tests: each column is 5 + z with z ~ N(0, 1), drawn feature
/// by feature from the sampling stream of (seed, 0, 0). The generator comes back so a test draws
/// its outcome from the same stream after the features, and the standardised values z beside the
/// matrix so the outcome can be a known function of them.
/// </summary>
public static class StandardNormalFeatures
{
    public static (FeatureMatrix Matrix, double[][] Standardised, Xoshiro256StarStar Generator) Draw(
        int samples, int features, ulong seed, Func<int, string> sampleId)
    {
        var generator = SeedSchedule.Generator(seed, 0, 0, SeedPurpose.Sampling);
        var columns = new float[features][];
        var z = new double[features][];
        for (int f = 0; f < features; f++)
        {
            columns[f] = new float[samples];
            z[f] = new double[samples];
            for (int s = 0; s < samples; s++)
            {
                z[f][s] = generator.NextGaussian();
                columns[f][s] = (float)(5 + z[f][s]);
            }
        }
        var matrix = new FeatureMatrix(Enumerable.Range(0, features).Select(f => $"SIM{f:D3}").ToArray(),
            Enumerable.Range(0, samples).Select(sampleId).ToArray(), columns, new CellState[]?[features]);
        return (matrix, z, generator);
    }
}
