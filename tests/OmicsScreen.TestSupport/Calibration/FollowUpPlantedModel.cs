using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// Planted design for censored follow-up: a Cox model in which a few independent markers raise the
/// hazard log-linearly and one more raises it only above its upper quartile.
/// </summary>
/// <remarks>
/// eta = sum_m beta_m x_m + gamma 1[x_t &gt; Phi^-1(0.75)], x the markers' standardised (log)
/// values, each independent of every block; follow-up from <see cref="FollowUpDesign"/> (exponential
/// event times with hazard h0 exp(eta), independent exponential censoring).
/// Default parameters (the calibration suite's): 150 samples x 1,000 log-normal features, the
/// background in blocks of 5 with rho = 0.6; log hazard ratios per SD 0.5, 0.6, 0.7 and 0.8;
/// gamma = ln 3 (hazard ratio 3 above the upper quartile); censoring hazard set for 30% censored
/// at the baseline hazard (fewer with the markers, whose hazards are on average higher).
/// Truly related: the four markers and the threshold marker.
/// Each marker's own (marginal) Cox coefficient is smaller than its coefficient in the joint model,
/// because the other markers act as unmeasured heterogeneity (the non-collapsibility of the hazard
/// ratio; Gail, Wieand & Piantadosi 1984, from memory): measured on a 4,000-sample cohort of seed
/// number 1, 0.27, 0.33, 0.45 and 0.54 per SD for the four markers and 0.60 for the threshold
/// indicator (conditional 0.5-0.8 and 1.10), so with about 95 events in a 150-sample discovery
/// panel the markers' univariate p-values range from about 1e-7 to 0.07.
/// </remarks>
public sealed class FollowUpPlantedModel : CalibrationModel
{
    private readonly int[] _markers;
    private readonly double[] _effects;
    private readonly int _thresholdMarker;
    private readonly HashSet<int> _independent;

    public FollowUpPlantedModel(string name, ulong seed, int sampleCount, BackgroundDesign background, FollowUpDesign followUp,
        IReadOnlyList<double> logHazardRatios, double thresholdLogHazardRatio)
        : base(name, seed, sampleCount, background, OutcomeKind.TimeToEvent)
    {
        ArgumentNullException.ThrowIfNull(logHazardRatios);
        FollowUp = followUp ?? throw new ArgumentNullException(nameof(followUp));
        _effects = logHazardRatios.ToArray();
        ThresholdLogHazardRatio = thresholdLogHazardRatio;
        var generator = PlacementGenerator();
        var planted = DrawDistinct(1 + _effects.Length, background.FeatureCount, ref generator);
        _thresholdMarker = planted[0];
        _markers = planted[1..];
        _independent = [.. planted];
        foreach (int f in planted) MarkRelated(f);
    }

    /// <summary>Default log hazard ratios per SD of the four markers.</summary>
    public static IReadOnlyList<double> DefaultLogHazardRatios { get; } = [0.5, 0.6, 0.7, 0.8];

    /// <summary>ln 3: a hazard three times the baseline above the threshold marker's upper quartile.</summary>
    public static double DefaultThresholdLogHazardRatio { get; } = Math.Log(3);

    public FollowUpDesign FollowUp { get; }

    public IReadOnlyList<int> Markers => _markers;

    public IReadOnlyList<double> LogHazardRatios => _effects;

    public double ThresholdLogHazardRatio { get; }

    public override int ThresholdMarker => _thresholdMarker;

    protected override bool IsIndependent(int feature) => _independent.Contains(feature);

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator)
    {
        int sampleCount = standardised[0].Length;
        var logHazard = new double[sampleCount];
        var threshold = standardised[_thresholdMarker];
        for (int s = 0; s < sampleCount; s++)
        {
            double eta = threshold[s] > ThresholdModel.UpperQuartile ? ThresholdLogHazardRatio : 0;
            for (int m = 0; m < _markers.Length; m++) eta += _effects[m] * standardised[_markers[m]][s];
            logHazard[s] = eta;
        }
        return FollowUp.Draw(logHazard, ref generator);
    }
}
