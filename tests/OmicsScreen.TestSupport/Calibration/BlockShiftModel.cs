using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// Planted design (a), marginal shifts in correlated blocks: two classes in equal shares; in a few
/// informative blocks the shared latent factor u_b is shifted in the positive class, so every
/// member of such a block is truly associated with the outcome, while the latent factors of all
/// other blocks are independent of it.
/// </summary>
/// <remarks>
/// A member's standardised value is z = sqrt(rho) (u_b + delta_b / sqrt(rho) y) + sqrt(1 - rho) e,
/// so each member shifts by delta_b (its own SD units) and members stay correlated rho within a
/// class. Informative blocks are drawn at random among the whole blocks, once per model.
/// Default parameters (the calibration suite's): 150 samples x 1,000 log-normal features in
/// blocks of 5 with rho = 0.6; three informative blocks with delta = 0.6, 0.8 and 1.0 SD, so
/// 15 features are truly associated.
/// </remarks>
public sealed class BlockShiftModel : CalibrationModel
{
    private readonly int[] _informativeBlocks;
    private readonly double[] _effects;

    /// <param name="effects">delta_b in SD units, one per informative block.</param>
    public BlockShiftModel(string name, ulong seed, int sampleCount, BackgroundDesign background, IReadOnlyList<double> effects)
        : base(name, seed, sampleCount, background, ["control", "case"], positiveClass: 1)
    {
        ArgumentNullException.ThrowIfNull(effects);
        if (background.BlockSize < 2 || background.BlockCorrelation <= 0)
            throw new ArgumentException("A shift of a block's latent factor needs blocks of at least 2 correlated features.");
        _effects = effects.ToArray();
        int wholeBlocks = background.FeatureCount / background.BlockSize;
        var generator = PlacementGenerator();
        _informativeBlocks = DrawDistinct(_effects.Length, wholeBlocks, ref generator);
        foreach (int block in _informativeBlocks)
            for (int i = 0; i < background.BlockSize; i++) MarkRelated(block * background.BlockSize + i);
    }

    /// <summary>Block indices (feature / block size) whose latent factor is shifted, in effect order.</summary>
    public IReadOnlyList<int> InformativeBlocks => _informativeBlocks;

    public IReadOnlyList<double> Effects => _effects;

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator)
    {
        int sampleCount = standardised[0].Length, blockSize = Background.BlockSize;
        var classes = ClassesInShares(sampleCount, [0.5, 0.5], ref generator);
        for (int b = 0; b < _informativeBlocks.Length; b++)
            for (int i = 0; i < blockSize; i++)
            {
                var column = standardised[_informativeBlocks[b] * blockSize + i];
                // sqrt(rho) x (delta / sqrt(rho)) = delta: the latent shift as each member sees it.
                for (int s = 0; s < sampleCount; s++) if (classes[s] == 1) column[s] += _effects[b];
            }
        return DrawnOutcome.OfClasses(classes);
    }
}
