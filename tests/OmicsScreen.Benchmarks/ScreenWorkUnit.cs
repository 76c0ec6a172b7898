namespace OmicsScreen.Benchmarks;

/// <summary>
/// A piece of a screen that runs whole on one node when a screen is split into parts: the
/// reference forest, one half-sample repeat, or one outer fold of the panel-size curve.
/// </summary>
public sealed record ScreenWorkUnit(string Stage, int ForestCount, double CoreSeconds);
