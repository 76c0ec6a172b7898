using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport;

/// <summary>
/// Simulated omics panels with known truth, in the style of published simulation studies of
/// random-forest variable selection (e.g. Degenhardt, Seifert &amp; Szymczak 2019, Briefings in
/// Bioinformatics 20(2), from memory): features in correlated blocks; some blocks hold causal
/// features whose class means differ, mixed with noise features correlated with them; the rest
/// is noise.
/// </summary>
/// <remarks>
/// Every feature: x = sqrt(rho) z_block + sqrt(1 - rho) e, standard normal z and e. A causal
/// feature adds its effect (in SD units) in the positive class. Values are exponentiated to look
/// like abundances; trees and rank tests see only their order.
/// </remarks>
public static class CausalBlockPanel
{
    public sealed record Design
    {
        public int SampleCount { get; init; } = 100;
        public int FeatureCount { get; init; } = 1000;
        public int CausalBlocks { get; init; } = 6;
        public int CausalPerBlock { get; init; } = 5;
        public int BlockSize { get; init; } = 10;
        public double BlockCorrelation { get; init; } = 0.5;
        public double MinEffect { get; init; } = 0.6;
        public double MaxEffect { get; init; } = 1.2;
        public double CaseFraction { get; init; } = 0.5;
        /// <summary>When true, no feature carries any effect (a null panel).</summary>
        public bool Null { get; init; }
        public ulong Seed { get; init; } = 1;
    }

    /// <summary>The panel and, per feature, whether it is causal.</summary>
    public static (Panel Panel, bool[] Causal) Generate(Design design)
    {
        var random = new Xoshiro256StarStar(design.Seed);
        int n = design.SampleCount, p = design.FeatureCount;
        int cases = (int)Math.Round(design.CaseFraction * n);
        var classes = new int[n];
        for (int s = 0; s < n; s++) classes[s] = s < cases ? 1 : 0;
        random.Shuffle(classes.AsSpan());

        var causal = new bool[p];
        var effect = new double[p];
        if (!design.Null)
            for (int b = 0; b < design.CausalBlocks; b++)
                for (int i = 0; i < design.CausalPerBlock; i++)
                {
                    int f = b * design.BlockSize + i;
                    causal[f] = true;
                    effect[f] = design.MinEffect + (design.MaxEffect - design.MinEffect) * random.NextDouble();
                }

        int blockCount = (p + design.BlockSize - 1) / design.BlockSize;
        var latent = new double[blockCount, n];
        for (int b = 0; b < blockCount; b++)
            for (int s = 0; s < n; s++) latent[b, s] = random.NextGaussian();
        double shared = Math.Sqrt(design.BlockCorrelation), own = Math.Sqrt(1 - design.BlockCorrelation);
        var columns = new float[p][];
        for (int f = 0; f < p; f++)
        {
            var column = new float[n];
            for (int s = 0; s < n; s++)
            {
                double x = shared * latent[f / design.BlockSize, s] + own * random.NextGaussian();
                if (classes[s] == 1) x += effect[f];
                column[s] = (float)Math.Exp(x);
            }
            columns[f] = column;
        }
        var names = Enumerable.Range(0, p).Select(f => $"V{f:D5}").ToArray();
        var ids = Enumerable.Range(0, n).Select(s => $"R{s:D4}").ToArray();
        var matrix = new FeatureMatrix(names, ids, columns, new CellState[]?[p]);
        return (new Panel(matrix, new ClassOutcome("status", ["control", "case"], classes, positiveClass: 1)), causal);
    }
}
