namespace OmicsScreen.Reporting.Charts;

/// <summary>One legend entry: a swatch and its name.</summary>
internal readonly record struct LegendEntry(string Name, string Colour, LegendSymbol Symbol);
