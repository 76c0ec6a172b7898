using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// Planted design (c), a threshold effect: the probability of "case" jumps when one marker
/// exceeds its upper quartile and does not change below it; a few independent marginal markers
/// are then shifted in the cases.
/// </summary>
/// <remarks>
/// The marker's standardised value x is standard normal and independent of every block; its upper
/// quartile is Phi^-1(0.75) = 0.6745 (from memory; a unit test checks that a quarter of the
/// samples lie above it). P(case | x) = 0.35 for x &lt;= 0.6745 and 0.95 above, so
/// P(case) = 0.75 x 0.35 + 0.25 x 0.95 = 0.5 in expectation.
/// Default parameters (the calibration suite's): 150 samples x 1,000 log-normal features, the
/// background in blocks of 5 with rho = 0.6; marginal shifts 0.8, 1.0 and 1.2 SD.
/// Truly related: the threshold marker and the three markers.
/// </remarks>
public sealed class ThresholdModel : CalibrationModel
{
    /// <summary>Phi^-1(0.75), the upper quartile of the standard normal.</summary>
    public const double UpperQuartile = 0.6744897501960817;

    private readonly int _marker;
    private readonly int[] _markers;
    private readonly double[] _effects;
    private readonly HashSet<int> _independent;

    public ThresholdModel(string name, ulong seed, int sampleCount, BackgroundDesign background,
        IReadOnlyList<double> markerEffects, double caseRateBelow = 0.35, double caseRateAbove = 0.95)
        : base(name, seed, sampleCount, background, ["control", "case"], positiveClass: 1)
    {
        ArgumentNullException.ThrowIfNull(markerEffects);
        CaseRateBelow = caseRateBelow;
        CaseRateAbove = caseRateAbove;
        _effects = markerEffects.ToArray();
        var generator = PlacementGenerator();
        var planted = DrawDistinct(1 + _effects.Length, background.FeatureCount, ref generator);
        _marker = planted[0];
        _markers = planted[1..];
        _independent = [.. planted];
        foreach (int f in planted) MarkRelated(f);
    }

    public double CaseRateBelow { get; }

    public double CaseRateAbove { get; }

    public override int ThresholdMarker => _marker;

    public IReadOnlyList<int> Markers => _markers;

    protected override bool IsIndependent(int feature) => _independent.Contains(feature);

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator)
    {
        var marker = standardised[_marker];
        var classes = new int[marker.Length];
        for (int s = 0; s < classes.Length; s++)
        {
            double rate = marker[s] > UpperQuartile ? CaseRateAbove : CaseRateBelow;
            classes[s] = generator.NextDouble() < rate ? 1 : 0;
        }
        MarginalMarkers.Shift(standardised, _markers, _effects, classes);
        return DrawnOutcome.OfClasses(classes);
    }
}
