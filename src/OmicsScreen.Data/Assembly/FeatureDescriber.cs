using OmicsScreen.Data.Inspection;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Gathers what the inputs say about each feature (describing columns of the matrix file, the
/// feature sheet) into <see cref="FeatureDescriptions"/>, in matrix feature order.
/// </summary>
internal static class FeatureDescriber
{
    /// <summary>The feature-sheet column taken as display names when <see cref="PanelLoadOptions.DisplayNameColumn"/> is not given.</summary>
    public const string DefaultDisplayNameColumn = "display_name";

    public static (FeatureDescriptions Descriptions, FeatureColumnsFound? Columns) FromMatrix(RawMatrix raw, PanelLoadOptions options)
    {
        var ids = raw.Matrix.FeatureNames;
        var annotations = new List<FeatureAnnotation>();
        string[]? displayNames = null;
        foreach (var (name, values) in raw.FeatureAnnotations)
        {
            if (options.DisplayNameColumn == name) displayNames = values;
            else annotations.Add(new FeatureAnnotation(name, values));
        }
        var found = raw.FeatureIdColumn is { } idColumn && (raw.FeatureAnnotations.Count > 0 || options.FeatureColumns is not null || raw.FeatureColumnsDetected)
            ? new FeatureColumnsFound(idColumn, raw.FeatureAnnotations.Select(a => a.Name).ToArray(), raw.FeatureColumnsDetected)
            : null;
        return (new FeatureDescriptions(ids, displayNames, annotations), found);
    }
}
