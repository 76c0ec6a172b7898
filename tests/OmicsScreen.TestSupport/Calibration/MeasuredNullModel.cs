using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// A panel whose measured outcome is independent of every feature, so any feature the screen
/// shortlists is a false discovery: y = 50 + 10 e (normal) or y = 10 exp(e) (log-normal, skewness
/// about 6), e standard normal, drawn after the background.
/// </summary>
public sealed class MeasuredNullModel : CalibrationModel
{
    public MeasuredNullModel(string name, ulong seed, int sampleCount, BackgroundDesign background, bool skewedOutcome)
        : base(name, seed, sampleCount, background, OutcomeKind.Measured)
    {
        SkewedOutcome = skewedOutcome;
    }

    /// <summary>True for a log-normal outcome, false for a normal one.</summary>
    public bool SkewedOutcome { get; }

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator)
    {
        var values = new double[standardised[0].Length];
        for (int s = 0; s < values.Length; s++)
        {
            double e = generator.NextGaussian();
            values[s] = SkewedOutcome ? 10 * Math.Exp(e) : 50 + 10 * e;
        }
        return DrawnOutcome.OfMeasured(values);
    }
}
