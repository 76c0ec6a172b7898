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
                    "Give --id-column an existing column (names are case-sensitive), or leave it out to use the first column.");
        }
        if (options.SampleSheetPath is null) CheckRoleColumnsSpelling(header, options, filePath, isTableRow);
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
                "Check the delimiter; if the file has one feature per row, add --features-in-rows.");
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

    /// <summary>
    /// Without a sample sheet every named column must be in the matrix. A name that differs only by
    /// case would otherwise be read as a feature and fail on its first text cell, which names the
    /// wrong column; this names the option and the column the user meant.
    /// </summary>
    private static void CheckRoleColumnsSpelling(IReadOnlyList<string> header, PanelLoadOptions options, string filePath, bool isTableRow)
    {
        var roles = new List<(string Option, string Name)>();
        if (options.OutcomeColumn is { } outcome) roles.Add(("--outcome", outcome));
        if (options.FollowUpColumn is { } followUp) roles.Add(("--follow-up", followUp));
        if (options.EventColumn is { } eventColumn) roles.Add(("--event", eventColumn));
        if (options.CohortColumn is { } cohort) roles.Add(("--cohort", cohort));
        if (options.SubjectColumn is { } subject) roles.Add(("--subject", subject));
        foreach (var annotation in options.AnnotationColumns) roles.Add(("--annotation", annotation));
        var declared = options.SampleAttributeNames();
        foreach (var (option, name) in roles)
        {
            if (IndexOf(header, name) >= 0) continue;
            foreach (var column in header)
                // A column declared under its own spelling is read as text anyway; the assembler names the mismatch.
                if (string.Equals(column, name, StringComparison.OrdinalIgnoreCase) && !declared.Contains(column))
                    throw PanelInputException.At(filePath, isTableRow ? null : 1, null,
                        $"no column '{Display.Name(name)}' (named by {option}); did you mean '{Display.Name(column)}'?",
                        $"Column names are case-sensitive: use {option} {Display.Name(column)}.");
        }
    }

    /// <summary>The fix for a text cell in a feature column, when the outcome column named is not in the file at all.</summary>
    internal static string? OutcomeNotInHeaderFix(IReadOnlyList<string> header, PanelLoadOptions options, string textColumn)
    {
        if (options.SampleSheetPath is not null || options.OutcomeColumn is null || IndexOf(header, options.OutcomeColumn) >= 0) return null;
        return $"The file has no column '{Display.Name(options.OutcomeColumn)}' named by --outcome. If '{Display.Name(textColumn)}' holds each sample's class, use --outcome {Display.Name(textColumn)}; "
            + "if it describes samples in another way, name it with --annotation.";
    }

    private static int IndexOf(IReadOnlyList<string> header, string name)
    {
        for (int c = 0; c < header.Count; c++)
            if (string.Equals(header[c], name, StringComparison.Ordinal)) return c;
        return -1;
    }
}
