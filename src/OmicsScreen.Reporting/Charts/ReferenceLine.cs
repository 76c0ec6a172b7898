namespace OmicsScreen.Reporting.Charts;

/// <summary>A labelled dashed line at a fixed value: a selection threshold, a chance level, a target error.</summary>
public sealed record ReferenceLine(ChartAxis Axis, double Value, string Label);
