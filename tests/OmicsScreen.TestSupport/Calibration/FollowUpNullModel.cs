using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// A panel whose follow-up is independent of every feature (every sample has the baseline
/// hazard), so any feature the screen shortlists is a false discovery.
/// </summary>
public sealed class FollowUpNullModel : CalibrationModel
{
    public FollowUpNullModel(string name, ulong seed, int sampleCount, BackgroundDesign background, FollowUpDesign followUp)
        : base(name, seed, sampleCount, background, OutcomeKind.TimeToEvent)
    {
        FollowUp = followUp ?? throw new ArgumentNullException(nameof(followUp));
    }

    public FollowUpDesign FollowUp { get; }

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator) =>
        FollowUp.Draw(new double[standardised[0].Length], ref generator);
}
