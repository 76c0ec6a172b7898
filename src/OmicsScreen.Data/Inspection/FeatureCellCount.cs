namespace OmicsScreen.Data.Inspection;

/// <summary>A feature and a number of its cells, e.g. those below its detection limit.</summary>
public sealed record FeatureCellCount(string Feature, int Cells);
