using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// Planted design for a measured outcome: the outcome rises linearly with the mean standardised
/// (log) value of a few informative blocks, steps up when one independent marker exceeds its
/// upper quartile, and carries normal noise.
/// </summary>
/// <remarks>
/// y = sum_b beta_b m_b / sqrt(rho + (1 - rho) / k) + gamma 1[x &gt; Phi^-1(0.75)] + e, with m_b the
/// mean of the k members' standardised values of informative block b (its SD is
/// sqrt(rho + (1 - rho) / k), so beta_b is per SD of the block mean), x the threshold marker's
/// standardised value (independent of every block), e ~ N(0, 1). Every member of an informative
/// block is truly related (it correlates with m_b), as is the threshold marker.
/// Default parameters (the calibration suite's): 150 samples x 1,000 log-normal features in blocks
/// of 5 with rho = 0.6; beta = 0.4, 0.55, 0.7; gamma = 1.2. Then Var(y) = 0.9525 + 1.44 x 0.1875
/// + 1 = 2.22, the model's R^2 is 0.55, a block member correlates 0.22-0.39 with y and the
/// threshold indicator 0.35.
/// </remarks>
public sealed class MeasuredPlantedModel : CalibrationModel
{
    private readonly int[] _informativeBlocks;
    private readonly double[] _effects;
    private readonly int _thresholdMarker;

    public MeasuredPlantedModel(string name, ulong seed, int sampleCount, BackgroundDesign background,
        IReadOnlyList<double> blockEffects, double thresholdEffect)
        : base(name, seed, sampleCount, background, OutcomeKind.Measured)
    {
        ArgumentNullException.ThrowIfNull(blockEffects);
        if (background.BlockSize < 2 || background.BlockCorrelation <= 0)
            throw new ArgumentException("Block effects need blocks of at least 2 correlated features.");
        _effects = blockEffects.ToArray();
        ThresholdEffect = thresholdEffect;
        int wholeBlocks = background.FeatureCount / background.BlockSize;
        var generator = PlacementGenerator();
        _informativeBlocks = DrawDistinct(_effects.Length, wholeBlocks, ref generator);
        foreach (int block in _informativeBlocks)
            for (int i = 0; i < background.BlockSize; i++) MarkRelated(block * background.BlockSize + i);
        // The threshold marker is any feature outside the informative blocks, freed from its own block.
        int marker;
        do marker = generator.NextInt(background.FeatureCount);
        while (Truth[marker]);
        _thresholdMarker = marker;
        MarkRelated(marker);
    }

    /// <summary>Default block effects, per SD of the block mean.</summary>
    public static IReadOnlyList<double> DefaultBlockEffects { get; } = [0.4, 0.55, 0.7];

    public const double DefaultThresholdEffect = 1.2;

    public IReadOnlyList<int> InformativeBlocks => _informativeBlocks;

    public IReadOnlyList<double> Effects => _effects;

    public double ThresholdEffect { get; }

    public override int ThresholdMarker => _thresholdMarker;

    protected override bool IsIndependent(int feature) => feature == _thresholdMarker;

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator)
    {
        int sampleCount = standardised[0].Length, blockSize = Background.BlockSize;
        double rho = Background.BlockCorrelation;
        double meanScale = Math.Sqrt(rho + (1 - rho) / blockSize);
        var values = new double[sampleCount];
        var marker = standardised[_thresholdMarker];
        for (int s = 0; s < sampleCount; s++)
        {
            double y = marker[s] > ThresholdModel.UpperQuartile ? ThresholdEffect : 0;
            for (int b = 0; b < _informativeBlocks.Length; b++)
            {
                double sum = 0;
                for (int i = 0; i < blockSize; i++) sum += standardised[_informativeBlocks[b] * blockSize + i][s];
                y += _effects[b] * (sum / blockSize) / meanScale;
            }
            values[s] = y + generator.NextGaussian();
        }
        return DrawnOutcome.OfMeasured(values);
    }
}
