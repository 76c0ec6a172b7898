using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// Planted design (b), an interacting pair with no marginal shift: the class is "case" when the
/// standardised values of two independent features have the same sign (x1 x2 &gt; 0, both above
/// or both below their medians), with the label flipped at random with probability
/// <see cref="LabelNoise"/>; a few independent marginal markers are then shifted in the cases.
/// </summary>
/// <remarks>
/// Each of the pair alone carries no information: x1 is symmetric about 0 and independent of x2,
/// so P(case | x1) = P(x2 has x1's sign) = 1/2 whatever x1 is; jointly they give P(case) = 0.9
/// or 0.1 by quadrant. Cases make up half the samples in expectation, not exactly.
/// Default parameters (the calibration suite's): 150 samples x 1,000 log-normal features, the
/// background in blocks of 5 with rho = 0.6; the pair and the markers sit at random positions
/// and are independent of every block; label noise 0.1; marginal shifts 0.8, 1.0 and 1.2 SD.
/// Truly related: the pair and the three markers.
/// </remarks>
public sealed class InteractionModel : CalibrationModel
{
    private readonly int[] _pair;
    private readonly int[] _markers;
    private readonly double[] _effects;
    private readonly HashSet<int> _independent;

    public InteractionModel(string name, ulong seed, int sampleCount, BackgroundDesign background,
        IReadOnlyList<double> markerEffects, double labelNoise = 0.1)
        : base(name, seed, sampleCount, background, ["control", "case"], positiveClass: 1)
    {
        ArgumentNullException.ThrowIfNull(markerEffects);
        if (!(labelNoise >= 0 && labelNoise < 0.5)) throw new ArgumentException("Label noise must lie in [0, 0.5).");
        LabelNoise = labelNoise;
        _effects = markerEffects.ToArray();
        var generator = PlacementGenerator();
        var planted = DrawDistinct(2 + _effects.Length, background.FeatureCount, ref generator);
        _pair = planted[..2];
        _markers = planted[2..];
        _independent = [.. planted];
        foreach (int f in planted) MarkRelated(f);
    }

    public double LabelNoise { get; }

    public override IReadOnlyList<int> InteractingPair => _pair;

    public IReadOnlyList<int> Markers => _markers;

    protected override bool IsIndependent(int feature) => _independent.Contains(feature);

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator)
    {
        var first = standardised[_pair[0]];
        var second = standardised[_pair[1]];
        var classes = new int[first.Length];
        for (int s = 0; s < classes.Length; s++)
        {
            int label = first[s] * second[s] > 0 ? 1 : 0;
            if (generator.NextDouble() < LabelNoise) label = 1 - label;
            classes[s] = label;
        }
        MarginalMarkers.Shift(standardised, _markers, _effects, classes);
        return DrawnOutcome.OfClasses(classes);
    }
}
