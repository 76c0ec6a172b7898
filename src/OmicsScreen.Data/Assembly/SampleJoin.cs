using System.Globalization;
using System.Text;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Text;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Matches matrix samples to sample-sheet rows by id. The panel keeps matrix order; the sheet
/// may list samples in any order.
/// </summary>
internal sealed class SampleJoin
{
    private SampleJoin(int[] keptSamples, int[] sheetRows, string[] droppedSamples)
    {
        KeptSamples = keptSamples;
        SheetRows = sheetRows;
        DroppedSamples = droppedSamples;
    }

    /// <summary>Matrix sample indices kept, in matrix order.</summary>
    public int[] KeptSamples { get; }

    /// <summary>For each kept sample, its sheet row (or -1 without a sheet).</summary>
    public int[] SheetRows { get; }

    /// <summary>Ids found in only one of the two files and dropped (matrix ones first).</summary>
    public string[] DroppedSamples { get; }

    public static SampleJoin WithoutSheet(int sampleCount)
    {
        var kept = new int[sampleCount];
        var rows = new int[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            kept[s] = s;
            rows[s] = -1;
        }
        return new SampleJoin(kept, rows, []);
    }

    /// <param name="matrixFeatureNames">The matrix's feature names, to recognise a matrix read in the wrong orientation.</param>
    public static SampleJoin Match(IReadOnlyList<string> matrixIds, IReadOnlyList<string> matrixFeatureNames, string matrixPath, SampleSheet sheet,
        PanelLoadOptions options, List<InspectionFinding> findings)
    {
        int idColumn = options.SampleIdColumn is { } name && sheet.IndexOf(name) >= 0 ? sheet.IndexOf(name) : 0;
        var sheetIds = sheet.Columns[idColumn];
        var rowOfId = new Dictionary<string, int>(sheetIds.Length, StringComparer.Ordinal);
        for (int r = 0; r < sheetIds.Length; r++)
        {
            NameRules.Check(sheetIds[r], "sample id", sheet.Path, sheet.Lines[r], sheet.ColumnNames[idColumn]);
            if (!rowOfId.TryAdd(sheetIds[r], r))
                throw PanelInputException.At(sheet.Path, sheet.Lines[r], sheet.ColumnNames[idColumn],
                    $"the sample id '{Display.Name(sheetIds[r])}' occurs more than once in the sample sheet.",
                    "Keep one sample-sheet row per sample.");
        }

        var kept = new List<int>(matrixIds.Count);
        var rows = new List<int>(matrixIds.Count);
        var matrixOnly = new List<string>();
        var inMatrix = new HashSet<string>(matrixIds, StringComparer.Ordinal);
        for (int s = 0; s < matrixIds.Count; s++)
        {
            if (rowOfId.TryGetValue(matrixIds[s], out int row))
            {
                kept.Add(s);
                rows.Add(row);
            }
            else matrixOnly.Add(matrixIds[s]);
        }
        var sheetOnly = new List<string>();
        foreach (var id in sheetIds)
            if (!inMatrix.Contains(id)) sheetOnly.Add(id);

        string sheetName = Path.GetFileName(sheet.Path);
        string matrixName = Path.GetFileName(matrixPath);
        if (kept.Count == 0)
        {
            string fix = "Check that the sample id column is the right one (name it with --id-column), and that ids are spelt the same way in both files.";
            if (LooksTransposed(sheetIds, matrixFeatureNames))
            {
                bool readAsSamplesInRows = options.Layout == PanelLayout.SamplesInRows;
                fix = $"The sheet's ids are column names of {matrixName}, so the matrix holds one row per {(readAsSamplesInRows ? "feature" : "sample")}: load it {(readAsSamplesInRows ? "with" : "without")} --features-in-rows.";
            }
            else if (NormalisationNote(matrixOnly, sheetOnly) is { } note) fix = note;
            throw PanelInputException.At(sheet.Path, null, sheet.ColumnNames[idColumn],
                $"no sample id matches the matrix {matrixName}: the sheet has {Display.List(sheetIds)}; the matrix has {Display.List(matrixIds)}.",
                fix);
        }
        if (matrixOnly.Count == 0 && sheetOnly.Count == 0)
            return new SampleJoin(kept.ToArray(), rows.ToArray(), []);

        string unmatched = Unmatched(matrixOnly, matrixName, sheetName) + Unmatched(sheetOnly, sheetName, matrixName);
        if (!options.DropUnmatchedSamples)
            throw PanelInputException.At(sheet.Path, null, sheet.ColumnNames[idColumn], $"samples do not match:{unmatched}",
                NormalisationNote(matrixOnly, sheetOnly)
                ?? "Fix the ids, or add --drop-unmatched to continue without them.");
        findings.Add(new InspectionFinding(FindingSeverity.Warning, "unmatched-samples-dropped",
            $"{matrixOnly.Count + sheetOnly.Count} samples were dropped because they are in only one file:{unmatched}"));
        return new SampleJoin(kept.ToArray(), rows.ToArray(), [.. matrixOnly, .. sheetOnly]);
    }

    /// <summary>
    /// A note when unmatched ids differ only in how accented letters are encoded (Unicode NFC in one
    /// file, NFD in the other): they print identically, so the message must say why they differ.
    /// The program runs with invariant globalisation, which has no normalisation tables, so two
    /// ids are taken as such a pair when one carries combining marks and, with the marks removed,
    /// each of its letters equals the other's or stands for an accented letter there.
    /// </summary>
    private static string? NormalisationNote(List<string> matrixOnly, List<string> sheetOnly)
    {
        string? example = null;
        int count = 0;
        foreach (var sheetId in sheetOnly)
            foreach (var matrixId in matrixOnly)
                if (LookAlikeUpToAccentEncoding(sheetId, matrixId) || LookAlikeUpToAccentEncoding(matrixId, sheetId))
                {
                    example ??= sheetId;
                    count++;
                    break;
                }
        if (example is null) return null;
        return FormattableString.Invariant(
            $"{count} ids (such as '{Display.Name(example)}') look the same in both files but encode their accented letters differently (Unicode NFC in one file, NFD in the other: 'é' as one character or as 'e' plus a combining accent). Save both files with the same Unicode normalisation (NFC is the usual one).");
    }

    /// <summary>True when <paramref name="decomposed"/> has combining marks and, without them, matches <paramref name="composed"/> letter for letter up to accents.</summary>
    private static bool LookAlikeUpToAccentEncoding(string decomposed, string composed)
    {
        var bases = new StringBuilder(decomposed.Length);
        foreach (char c in decomposed)
            if (CharUnicodeInfo.GetUnicodeCategory(c) != UnicodeCategory.NonSpacingMark) bases.Append(c);
        if (bases.Length == decomposed.Length || bases.Length != composed.Length) return false;
        for (int i = 0; i < composed.Length; i++)
            if (bases[i] != composed[i] && !(char.IsAsciiLetter(bases[i]) && composed[i] > '\u007F' && char.IsLetter(composed[i]))) return false;
        return true;
    }

    private static string Unmatched(List<string> ids, string inFile, string notInFile) =>
        ids.Count == 0 ? "" : FormattableString.Invariant($" {ids.Count} in {inFile} but not in {notInFile} ({Display.List(ids)}).");

    /// <summary>True when most sheet ids are feature names of the matrix: the matrix was read in the other orientation.</summary>
    private static bool LooksTransposed(IReadOnlyList<string> sheetIds, IReadOnlyList<string> matrixFeatureNames)
    {
        var featureNames = new HashSet<string>(matrixFeatureNames, StringComparer.Ordinal);
        int found = 0;
        foreach (var id in sheetIds)
            if (featureNames.Contains(id)) found++;
        return found * 2 > sheetIds.Count;
    }
}
