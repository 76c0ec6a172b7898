namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Which header columns of a features-in-rows table describe features (the feature id and its
/// annotations: a gene symbol, a protein name, a description) and which are samples.
/// </summary>
internal sealed class FeatureRowRoles
{
    /// <summary>Rows looked at to tell leading text columns from sample columns.</summary>
    public const int ScannedRows = 200;

    private FeatureRowRoles(int idColumn, int[] annotationColumns, int[] sampleColumns, string[] header, bool detected)
    {
        IdColumn = idColumn;
        AnnotationColumns = annotationColumns;
        SampleColumns = sampleColumns;
        Detected = detected;
        SampleIds = new string[sampleColumns.Length];
        for (int s = 0; s < sampleColumns.Length; s++) SampleIds[s] = header[sampleColumns[s]];
        AnnotationNames = new string[annotationColumns.Length];
        for (int a = 0; a < annotationColumns.Length; a++) AnnotationNames[a] = header[annotationColumns[a]];
    }

    /// <summary>The column naming each feature.</summary>
    public int IdColumn { get; }

    /// <summary>The other feature-describing columns, in file order.</summary>
    public int[] AnnotationColumns { get; }
    public string[] AnnotationNames { get; }
    public int[] SampleColumns { get; }
    public string[] SampleIds { get; }

    /// <summary>True when the describing columns were found as leading text columns rather than named.</summary>
    public bool Detected { get; }

    /// <summary>
    /// Named columns (<see cref="PanelLoadOptions.FeatureColumns"/>: the first names the feature)
    /// or, by default, the first column and every text column after it up to the first column of
    /// numbers (<paramref name="textColumnCount"/>, counted by the caller from the first rows).
    /// </summary>
    public static FeatureRowRoles Resolve(IReadOnlyList<string> header, PanelLoadOptions options, string filePath,
        Func<int> textColumnCount)
    {
        var headerArray = header.ToArray();
        if (options.FeatureColumns is { Count: > 0 } named)
        {
            var describing = new List<int>();
            foreach (var name in named)
            {
                int column = Array.IndexOf(headerArray, name);
                if (column < 0)
                    throw PanelInputException.At(filePath, 1, null,
                        $"has no column '{Display.Name(name)}' (named by --feature-columns); its columns start {Display.List(headerArray)}.",
                        "Name existing columns with --feature-columns (names are case-sensitive), or leave it out to take the leading text columns.");
                if (!describing.Contains(column)) describing.Add(column);
            }
            var annotations = describing.Skip(1).Order().ToArray();
            return new FeatureRowRoles(describing[0], annotations, SamplesExcept(header.Count, describing), headerArray, detected: false);
        }
        int leading = Math.Clamp(textColumnCount(), 1, header.Count);
        var leadingColumns = Enumerable.Range(0, leading).ToList();
        return new FeatureRowRoles(0, leadingColumns.Skip(1).ToArray(), SamplesExcept(header.Count, leadingColumns), headerArray, detected: true);
    }

    private static int[] SamplesExcept(int columnCount, List<int> describing)
    {
        var samples = new List<int>(columnCount);
        for (int c = 0; c < columnCount; c++)
            if (!describing.Contains(c)) samples.Add(c);
        return samples.ToArray();
    }
}
