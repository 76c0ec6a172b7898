namespace OmicsScreen.Data.Sizing;

/// <summary>
/// Samples x features of a matrix file, found from its header, line count or metadata without
/// parsing a value, with the file's format and size (what its reader will hold while loading).
/// An upper bound where the file holds rows that are neither features nor samples (sample
/// attribute rows of a features-in-rows file, blank lines).
/// </summary>
public readonly record struct PanelDimensions(int SampleCount, int FeatureCount, MatrixFileFormat Format, long FileBytes);
