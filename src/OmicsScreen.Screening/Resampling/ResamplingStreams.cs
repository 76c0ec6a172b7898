namespace OmicsScreen.Screening.Resampling;

/// <summary>
/// Index slots of <see cref="Engine.Randomness.SeedSchedule"/> used by resampling, kept apart so
/// that half-sample pairs and outer folds never share a random stream.
/// </summary>
internal static class ResamplingStreams
{
    public const int HalfSamples = 0;
    public const int OuterFolds = 1;
}
