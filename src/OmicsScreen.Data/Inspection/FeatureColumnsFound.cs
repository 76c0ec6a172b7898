namespace OmicsScreen.Data.Inspection;

/// <summary>The feature-describing columns of the matrix file: the one naming features and those travelling with them.</summary>
/// <param name="IdColumn">The column naming each feature.</param>
/// <param name="AnnotationColumns">The other describing columns, kept as feature annotations.</param>
/// <param name="Detected">True when taken as leading text columns by default rather than named with --feature-columns.</param>
public sealed record FeatureColumnsFound(string IdColumn, IReadOnlyList<string> AnnotationColumns, bool Detected);
