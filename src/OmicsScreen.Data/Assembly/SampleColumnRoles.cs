namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Which header columns of a samples-in-rows table hold the sample id, sample attributes (text)
/// and features (numbers).
/// </summary>
internal sealed class SampleColumnRoles
{
    private SampleColumnRoles(int idColumn, int[] attributeColumns, int[] featureColumns, string[] featureNames)
    {
        IdColumn = idColumn;
        AttributeColumns = attributeColumns;
        FeatureColumns = featureColumns;
        FeatureNames = featureNames;
    }

    public int IdColumn { get; }
    public int[] AttributeColumns { get; }
    public int[] FeatureColumns { get; }
    public string[] FeatureNames { get; }

    /// <param name="header">Column names, already trimmed of spaces.</param>
    public static SampleColumnRoles Resolve(IReadOnlyList<string> header, PanelLoadOptions options, string filePath,
        bool isTableRow)
    {
        int idColumn = 0;
        if (options.SampleIdColumn is { } idName)
        {
            idColumn = IndexOf(header, idName);
            if (idColumn < 0)
                throw PanelInputException.At(filePath, isTableRow ? null : 1, null,
                    $"has no sample id column '{Display.Name(idName)}'; its columns start {Display.List(header)}.",
                    "Name an existing column as the sample id column, or leave it unset to use the first column.");
        }
        var attributeNames = options.SampleAttributeNames();
        var attributes = new List<int>();
        var features = new List<int>(header.Count);
        var featureNames = new List<string>(header.Count);
        for (int c = 0; c < header.Count; c++)
        {
            if (c == idColumn) continue;
            if (attributeNames.Contains(header[c]))
            {
                attributes.Add(c);
                continue;
            }
            string name = header[c];
            if (name.Length == 0)
                throw PanelInputException.At(filePath, isTableRow ? null : 1, null,
                    FormattableString.Invariant($"column {c + 1} of the header has no name."),
                    "Give every feature column a name in the header row.");
            NameRules.Check(name, "feature name", filePath, isTableRow ? null : 1, null);
            features.Add(c);
            featureNames.Add(name);
        }
        if (features.Count == 0)
            throw PanelInputException.At(filePath, isTableRow ? null : 1, null,
                "has no feature columns: every column is the sample id or a sample attribute.",
                "Check the delimiter and the layout; with features in rows, set the layout to FeaturesInRows.");
        NameRules.CheckUnique(featureNames, "feature name", filePath,
            "Make feature names unique (for example add the assay or isoform to the name) and load again.");
        if (options.KeepFeatures is { } keep) KeepNamed(keep, features, featureNames, filePath, isTableRow);
        if (options.FeatureBlock is { } block)
        {
            var (first, end) = block.Range(features.Count);
            if (end <= first)
                throw PanelInputException.At(filePath, null, null,
                    FormattableString.Invariant($"has {features.Count} feature columns, too few for block {block}: the block would be empty."),
                    "Use fewer blocks than there are features.");
            features = features.GetRange(first, end - first);
            featureNames = featureNames.GetRange(first, end - first);
        }
        return new SampleColumnRoles(idColumn, attributes.ToArray(), features.ToArray(), featureNames.ToArray());
    }

    /// <summary>Keeps the named features, in file order; every name asked for must be a feature column.</summary>
    private static void KeepNamed(IReadOnlyList<string> keep, List<int> features, List<string> featureNames, string filePath, bool isTableRow)
    {
        var wanted = new HashSet<string>(keep, StringComparer.Ordinal);
        var present = new HashSet<string>(featureNames, StringComparer.Ordinal);
        var absent = keep.Where(name => !present.Contains(name)).Distinct(StringComparer.Ordinal).ToList();
        if (absent.Count > 0)
            throw PanelInputException.At(filePath, isTableRow ? null : 1, null,
                FormattableString.Invariant($"has no feature column named {Display.List(absent)} ({absent.Count} of the {wanted.Count} features asked for)."),
                "Keep only names of feature columns of this file (names are compared exactly, case included).");
        var keptColumns = new List<int>(wanted.Count);
        var keptNames = new List<string>(wanted.Count);
        for (int f = 0; f < features.Count; f++)
            if (wanted.Contains(featureNames[f]))
            {
                keptColumns.Add(features[f]);
                keptNames.Add(featureNames[f]);
            }
        features.Clear();
        features.AddRange(keptColumns);
        featureNames.Clear();
        featureNames.AddRange(keptNames);
    }

    private static int IndexOf(IReadOnlyList<string> header, string name)
    {
        for (int c = 0; c < header.Count; c++)
            if (string.Equals(header[c], name, StringComparison.Ordinal)) return c;
        return -1;
    }
}
