namespace OmicsScreen.Data;

/// <summary>How a matrix file is oriented.</summary>
public enum PanelLayout
{
    /// <summary>One row per sample, one column per feature (plus the sample id and annotation columns).</summary>
    SamplesInRows,
    /// <summary>One row per feature, one column per sample (the first column holds feature names).</summary>
    FeaturesInRows,
    /// <summary>One row per measured cell: sample, feature and value columns (a long or "tidy" table), pivoted while read.</summary>
    Long,
}
