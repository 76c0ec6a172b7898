using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Covariates;

/// <summary>
/// Invented panels with an age covariate and known truth (a design of our own; answers known by
/// construction). Age = 60 + 10 a with a ~ N(0, 1); sex is a coin flip unrelated to anything.
/// <list type="bullet">
/// <item>Proxy: markers SIM000-SIM002 are 0.7 a + 0.7 e (correlation with age about 0.71); the
/// outcome depends on age alone, P(case) = logistic(2.2 a). The markers add nothing over age.</item>
/// <item>Adds: markers SIM000-SIM002 are independent of age; logit P(case) = 1.5 a + 1.5 z0 +
/// 1.2 z1 + 1.0 z2. The markers add to age.</item>
/// </list>
/// The other features are N(0, 1) noise.
/// </summary>
internal static class CovariatePanels
{
    public const int MarkerCount = 3;

    public static Panel Proxy(int samples, int features, ulong seed) => Draw(samples, features, seed, proxy: true);

    public static Panel Adds(int samples, int features, ulong seed) => Draw(samples, features, seed, proxy: false);

    private static Panel Draw(int samples, int features, ulong seed, bool proxy)
    {
        var (matrix, z, generator) = StandardNormalFeatures.Draw(samples, features, seed, s => $"SIMS{s:D3}");
        var ageDraws = SeedSchedule.Generator(seed, 3, 0, SeedPurpose.Sampling);
        var a = new double[samples];
        var sex = new int[samples];
        for (int s = 0; s < samples; s++)
        {
            a[s] = ageDraws.NextGaussian();
            sex[s] = ageDraws.NextDouble() < 0.5 ? 0 : 1;
        }
        var columns = new float[features][];
        for (int f = 0; f < features; f++)
        {
            columns[f] = matrix.Column(f).ToArray();
            if (proxy && f < MarkerCount)
                for (int s = 0; s < samples; s++) columns[f][s] = (float)(5 + 0.7 * a[s] + 0.7 * z[f][s]);
        }
        var classes = new int[samples];
        for (int s = 0; s < samples; s++)
        {
            double logit = proxy ? 2.2 * a[s] : 1.5 * a[s] + 1.5 * z[0][s] + 1.2 * z[1][s] + 1.0 * z[2][s];
            classes[s] = generator.NextDouble() < 1 / (1 + Math.Exp(-logit)) ? 1 : 0;
        }
        var panel = new Panel(new FeatureMatrix(matrix.FeatureNames, matrix.SampleIds, columns, new CellState[]?[features]),
            new ClassOutcome("status", ["case", "control"], classes.Select(c => c == 1 ? 0 : 1).ToArray(), 0));
        var age = new double[samples];
        for (int s = 0; s < samples; s++) age[s] = 60 + 10 * a[s];
        return panel.WithCovariates([Covariate.Numeric("age", age), Covariate.Categorical("sex", ["F", "M"], sex)]);
    }
}
