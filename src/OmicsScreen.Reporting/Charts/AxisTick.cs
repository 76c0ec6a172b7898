namespace OmicsScreen.Reporting.Charts;

/// <summary>A tick mark: its value in data units and its label.</summary>
public readonly record struct AxisTick(double Value, string Label);
