using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// What a matrix reader found: the measurements, the sample attributes stored in the same file,
/// and how the file was written. Sample order is file order; nothing is joined yet.
/// </summary>
internal sealed class RawMatrix
{
    public RawMatrix(MatrixSource source, FeatureMatrix matrix, IReadOnlyDictionary<string, string[]> annotations,
        long[] sampleLines, IReadOnlyList<string> otherColumns)
    {
        Source = source;
        Matrix = matrix;
        Annotations = annotations;
        SampleLines = sampleLines;
        OtherColumns = otherColumns;
    }

    public MatrixSource Source { get; }

    /// <summary>The same reading with only the given features, in the given order (describing columns picked alike).</summary>
    public RawMatrix WithFeatures(int[] features)
    {
        var annotations = new List<(string Name, string[] Values)>(FeatureAnnotations.Count);
        foreach (var (name, values) in FeatureAnnotations)
        {
            var picked = new string[features.Length];
            for (int i = 0; i < picked.Length; i++) picked[i] = values[features[i]];
            annotations.Add((name, picked));
        }
        return new RawMatrix(Source, Matrix.SelectFeatures(features), Annotations, SampleLines, OtherColumns)
        {
            FeatureIdColumn = FeatureIdColumn,
            FeatureAnnotations = annotations,
            FeatureColumnsDetected = FeatureColumnsDetected,
        };
    }
    public FeatureMatrix Matrix { get; }

    /// <summary>Annotation columns (or, for features in rows, annotation rows) as text, in sample order.</summary>
    public IReadOnlyDictionary<string, string[]> Annotations { get; }

    /// <summary>Line (text) or row (table) each sample came from, for messages; 0 when a sample is a column.</summary>
    public long[] SampleLines { get; }

    /// <summary>The id and annotation column names, for "columns available" in messages.</summary>
    public IReadOnlyList<string> OtherColumns { get; }

    /// <summary>The column naming features (features in rows, long tables); null when features are columns.</summary>
    public string? FeatureIdColumn { get; init; }

    /// <summary>Feature-describing columns read with the matrix (name, one text per feature in matrix order).</summary>
    public IReadOnlyList<(string Name, string[] Values)> FeatureAnnotations { get; init; } = [];

    /// <summary>True when the describing columns were found as leading text columns rather than named by an option.</summary>
    public bool FeatureColumnsDetected { get; init; }
}
