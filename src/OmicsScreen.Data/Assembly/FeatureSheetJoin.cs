using System.Globalization;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Text;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Joins a feature sheet (CSV/TSV, one row per feature, the first column its id) to the matrix:
/// display names, annotation columns and per-feature detection limits. Features in only one of
/// the two files are refused, or dropped with a warning under --drop-unmatched, as samples are.
/// </summary>
internal static class FeatureSheetJoin
{
    public const string DefaultDetectionLimitColumn = "detection_limit";

    /// <summary>The sheet's per-feature detection limits, read before the matrix so the readers can apply them; null without a limit column.</summary>
    public static DetectionLimits? ReadLimits(SampleSheet sheet, PanelLoadOptions options)
    {
        int column = LimitColumn(sheet, options);
        if (column < 0) return null;
        var ids = sheet.Columns[0];
        var limits = new Dictionary<string, float>(ids.Length, StringComparer.Ordinal);
        for (int r = 0; r < ids.Length; r++)
        {
            string text = sheet.Columns[column][r];
            if (text.Length == 0) continue;
            var kind = CellText.Classify(text, out float limit);
            if (kind != CellKind.Measured)
                throw PanelInputException.At(sheet.Path, sheet.Lines[r], sheet.ColumnNames[column],
                    $"the detection limit '{Display.Name(text)}' of feature '{Display.Name(ids[r])}' is not a number.",
                    "Give each limit as a plain number in the feature's units (a point as decimal separator), or leave the cell empty for no limit.");
            limits.TryAdd(ids[r], limit);
        }
        return new DetectionLimits(limits);
    }

    private static int LimitColumn(SampleSheet sheet, PanelLoadOptions options)
    {
        if (options.DetectionLimitColumn is { } named)
        {
            int index = sheet.IndexOf(named);
            // A long table may hold the named column instead; only a sheet-only run must have it here.
            if (index < 0 && options.Layout != PanelLayout.Long)
                throw PanelInputException.At(sheet.Path, 1, null,
                    $"has no column '{Display.Name(named)}' (named by --detection-limit); its columns are {Display.List(sheet.ColumnNames, 12)}.",
                    "Name an existing column of the feature sheet (names are case-sensitive).");
            return index;
        }
        return sheet.IndexOf(DefaultDetectionLimitColumn);
    }

    /// <summary>Matches the matrix's features to the sheet's rows; returns the kept feature indices (matrix order), the descriptions and what was found.</summary>
    public static (int[] KeptFeatures, FeatureDescriptions Descriptions, FeatureSheetFound Found) Join(
        RawMatrix raw, FeatureDescriptions fromMatrix, SampleSheet sheet, PanelLoadOptions options, List<InspectionFinding> findings)
    {
        var matrixIds = raw.Matrix.FeatureNames;
        var sheetIds = sheet.Columns[0];
        string idName = sheet.ColumnNames[0];
        var rowOfId = new Dictionary<string, int>(sheetIds.Length, StringComparer.Ordinal);
        for (int r = 0; r < sheetIds.Length; r++)
        {
            NameRules.Check(sheetIds[r], "feature id", sheet.Path, sheet.Lines[r], idName);
            if (!rowOfId.TryAdd(sheetIds[r], r))
                throw PanelInputException.At(sheet.Path, sheet.Lines[r], idName,
                    $"the feature id '{Display.Name(sheetIds[r])}' occurs more than once in the feature sheet.",
                    "Keep one feature-sheet row per feature.");
        }

        var kept = new List<int>(matrixIds.Count);
        var rows = new List<int>(matrixIds.Count);
        var matrixOnly = new List<string>();
        for (int f = 0; f < matrixIds.Count; f++)
        {
            if (rowOfId.TryGetValue(matrixIds[f], out int row))
            {
                kept.Add(f);
                rows.Add(row);
            }
            else matrixOnly.Add(matrixIds[f]);
        }
        // A matrix narrowed to a block or a list holds only some of the sheet's features by design.
        bool narrowed = options.FeatureBlock is not null || options.KeepFeatures is not null;
        var inMatrix = new HashSet<string>(matrixIds, StringComparer.Ordinal);
        var sheetOnly = narrowed ? [] : sheetIds.Where(id => !inMatrix.Contains(id)).ToList();
        string sheetName = Path.GetFileName(sheet.Path);
        string matrixName = Path.GetFileName(raw.Source.Path);
        if (kept.Count == 0)
            throw PanelInputException.At(sheet.Path, null, idName,
                $"no feature id matches the matrix {matrixName}: the sheet has {Display.List(sheetIds)}; the matrix has {Display.List(matrixIds)}.",
                "The feature sheet's first column must hold the feature ids exactly as the matrix names them (case included).");
        if (matrixOnly.Count > 0 || sheetOnly.Count > 0)
        {
            string unmatched = Unmatched(matrixOnly, matrixName, sheetName) + Unmatched(sheetOnly, sheetName, matrixName);
            if (!options.DropUnmatchedSamples)
                throw PanelInputException.At(sheet.Path, null, idName, $"features do not match:{unmatched}",
                    "Fix the ids, or add --drop-unmatched to continue without the features of the matrix that the sheet does not describe.");
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "unmatched-features-dropped",
                $"{matrixOnly.Count} features of the matrix were dropped and {sheetOnly.Count} rows of the feature sheet ignored because they are in only one file:{unmatched}"));
        }

        int displayColumn = DisplayColumn(sheet, options, fromMatrix);
        int limitColumn = LimitColumn(sheet, options);
        var annotations = new List<FeatureAnnotation>();
        var annotationNames = new List<string>();
        var sheetColumnNames = new HashSet<string>(StringComparer.Ordinal);
        for (int c = 1; c < sheet.ColumnNames.Length; c++)
        {
            if (c == displayColumn || c == limitColumn || sheet.ColumnNames[c].Length == 0) continue;
            if (!sheetColumnNames.Add(sheet.ColumnNames[c])) continue;
            annotations.Add(new FeatureAnnotation(sheet.ColumnNames[c], Pick(sheet.Columns[c], rows)));
            annotationNames.Add(sheet.ColumnNames[c]);
        }
        // The matrix's own describing columns travel too, unless the sheet has a column of the same name.
        var fromMatrixKept = new List<FeatureAnnotation>();
        foreach (var annotation in fromMatrix.Annotations)
            if (!sheetColumnNames.Contains(annotation.Name))
                fromMatrixKept.Add(new FeatureAnnotation(annotation.Name, Pick(annotation.Values, kept)));
        var keptIds = kept.Select(f => matrixIds[f]).ToArray();
        IReadOnlyList<string>? displayNames = displayColumn >= 0 ? Pick(sheet.Columns[displayColumn], rows)
            : fromMatrix.DisplayNames is { } matrixNames ? Pick(matrixNames, kept) : null;
        var descriptions = new FeatureDescriptions(keptIds, displayNames, [.. fromMatrixKept, .. annotations]);

        var keptSet = new HashSet<string>(keptIds, StringComparer.Ordinal);
        FeatureCellCount[] censored = options.FeatureLimits is { } limits
            ? limits.CensoredCells.Where(c => keptSet.Contains(c.Key)).Select(c => new FeatureCellCount(c.Key, c.Value))
                .OrderByDescending(c => c.Cells).ThenBy(c => c.Feature, StringComparer.Ordinal).ToArray()
            : [];
        int withLimit = options.FeatureLimits is { } l ? keptIds.Count(id => l.TryGetLimit(id, out _)) : 0;
        var found = new FeatureSheetFound(sheet.Path, idName, displayColumn >= 0 ? sheet.ColumnNames[displayColumn] : null,
            annotationNames, limitColumn >= 0 ? sheet.ColumnNames[limitColumn] : null, withLimit, censored, matrixOnly, sheetOnly);
        return (kept.ToArray(), descriptions, found);
    }

    /// <summary>The display-name column: the one named by --display-name (the sheet's, unless the matrix has it), else display_name when present.</summary>
    private static int DisplayColumn(SampleSheet sheet, PanelLoadOptions options, FeatureDescriptions fromMatrix)
    {
        if (options.DisplayNameColumn is { } named)
        {
            int index = sheet.IndexOf(named);
            if (index < 0 && fromMatrix.DisplayNames is null)
                throw PanelInputException.At(sheet.Path, 1, null,
                    $"has no column '{Display.Name(named)}' (named by --display-name), and neither has the matrix; the sheet's columns are {Display.List(sheet.ColumnNames, 12)}.",
                    "Name an existing column (names are case-sensitive), or leave --display-name out to use a column named display_name.");
            return index;
        }
        return sheet.IndexOf(FeatureDescriber.DefaultDisplayNameColumn);
    }

    private static string[] Pick(IReadOnlyList<string> values, List<int> indices)
    {
        var picked = new string[indices.Count];
        for (int i = 0; i < picked.Length; i++) picked[i] = values[indices[i]];
        return picked;
    }

    private static string Unmatched(List<string> ids, string inFile, string notInFile) =>
        ids.Count == 0 ? "" : string.Create(CultureInfo.InvariantCulture, $" {ids.Count} in {inFile} but not in {notInFile} ({Display.List(ids)}).");
}
