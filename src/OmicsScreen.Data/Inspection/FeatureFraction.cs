namespace OmicsScreen.Data.Inspection;

/// <summary>A feature and a fraction of its samples, e.g. the fraction missing.</summary>
public sealed record FeatureFraction(string Feature, double Fraction);
