namespace OmicsScreen.Benchmarks;

/// <summary>
/// A piece of a screen that runs whole on one node when a screen is split into parts: the
/// reference forest, one half-sample repeat, or one outer fold of the panel-size curve.
/// </summary>
/// <param name="CoreSeconds">Work spread over all cores.</param>
/// <param name="SerialSeconds">Work on one thread (building permuted-copy columns), which more cores do not shorten.</param>
public sealed record ScreenWorkUnit(string Stage, int ForestCount, double CoreSeconds, double SerialSeconds)
{
    public double WallSeconds(int cores) => CoreSeconds / cores + SerialSeconds;

    /// <summary>Processor seconds, the figure comparable with a measured screen's processor time.</summary>
    public double ProcessorSeconds => CoreSeconds + SerialSeconds;
}
