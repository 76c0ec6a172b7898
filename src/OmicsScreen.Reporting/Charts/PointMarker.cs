namespace OmicsScreen.Reporting.Charts;

/// <summary>A highlighted, labelled point: for example the recommended panel size.</summary>
public sealed record PointMarker(double X, double Y, string Label);
