namespace OmicsScreen.Data;

/// <summary>One feature-describing column (a gene symbol, a protein name, an assay panel): one text per feature, in panel order.</summary>
public sealed record FeatureAnnotation(string Name, IReadOnlyList<string> Values);
