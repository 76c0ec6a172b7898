namespace OmicsScreen.Reporting.Charts;

/// <summary>One row of a dot-and-interval chart: a label, a central value and its spread (NaN ends draw no bar).</summary>
public sealed record DotIntervalItem(string Label, double Value, double Low, double High);
