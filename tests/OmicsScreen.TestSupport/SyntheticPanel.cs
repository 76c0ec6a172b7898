using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport;

/// <summary>Generates simulated panels deterministically from a <see cref="SyntheticPanelSpec"/>.</summary>
/// <remarks>
/// log x[s,f] = mu_f + sigma_f·(sqrt(rho)·z[s,block(f)] + sqrt(1-rho)·e[s,f]) + shift, with z and e
/// standard normal, mu_f ~ U(2, 8), sigma_f ~ U(0.3, 1). Informative feature f is shifted by
/// EffectSize·sigma_f in class f mod ClassCount. Samples are assigned to classes in blocks by share.
/// </remarks>
public static class SyntheticPanel
{
    public static Panel Generate(SyntheticPanelSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        int sampleCount = spec.SampleCount, featureCount = spec.FeatureCount, classCount = spec.ClassCount;
        var classes = AssignClasses(spec);
        var generator = new Xoshiro256StarStar(spec.Seed);
        int blockCount = (featureCount + spec.BlockSize - 1) / spec.BlockSize;
        var latent = new double[blockCount * sampleCount];
        for (int i = 0; i < latent.Length; i++) latent[i] = generator.NextGaussian();

        double shared = Math.Sqrt(spec.BlockCorrelation), own = Math.Sqrt(1 - spec.BlockCorrelation);
        var columns = new float[featureCount][];
        var states = new CellState[]?[featureCount];
        for (int f = 0; f < featureCount; f++)
        {
            double mu = 2 + 6 * generator.NextDouble();
            double sigma = 0.3 + 0.7 * generator.NextDouble();
            int block = f / spec.BlockSize;
            bool informative = f < spec.InformativeCount;
            int shiftedClass = f % classCount;
            var column = new float[sampleCount];
            for (int s = 0; s < sampleCount; s++)
            {
                double log = mu + sigma * (shared * latent[block * sampleCount + s] + own * generator.NextGaussian());
                if (informative && classes[s] == shiftedClass) log += spec.EffectSize * sigma;
                column[s] = (float)Math.Exp(log);
            }
            if (spec.MissingFraction > 0)
            {
                var state = new CellState[sampleCount];
                for (int s = 0; s < sampleCount; s++)
                    if (generator.NextDouble() < spec.MissingFraction)
                    {
                        state[s] = CellState.Missing;
                        column[s] = float.NaN;
                    }
                states[f] = state;
            }
            columns[f] = column;
        }
        var featureNames = new string[featureCount];
        for (int f = 0; f < featureCount; f++) featureNames[f] = "F" + f.ToString("D5", System.Globalization.CultureInfo.InvariantCulture);
        var sampleIds = new string[sampleCount];
        for (int s = 0; s < sampleCount; s++) sampleIds[s] = "S" + s.ToString("D5", System.Globalization.CultureInfo.InvariantCulture);
        var classNames = new string[classCount];
        for (int c = 0; c < classCount; c++) classNames[c] = "class" + c.ToString(System.Globalization.CultureInfo.InvariantCulture);
        var matrix = new FeatureMatrix(featureNames, sampleIds, columns, states);
        return new Panel(matrix, new ClassOutcome("outcome", classNames, classes));
    }

    private static int[] AssignClasses(SyntheticPanelSpec spec)
    {
        var fractions = spec.ClassFractions ?? Enumerable.Repeat(1.0 / spec.ClassCount, spec.ClassCount).ToArray();
        var classes = new int[spec.SampleCount];
        double cumulative = 0;
        int start = 0;
        for (int c = 0; c < spec.ClassCount; c++)
        {
            cumulative += fractions[c];
            int end = c == spec.ClassCount - 1 ? spec.SampleCount : (int)Math.Round(cumulative * spec.SampleCount);
            for (int s = start; s < end; s++) classes[s] = c;
            start = end;
        }
        return classes;
    }
}
