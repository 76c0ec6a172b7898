using System.Runtime.CompilerServices;
using nietras.SeparatedValues;
using OmicsScreen.Data.Assembly;

namespace OmicsScreen.Data.Text;

/// <summary>
/// Streams a CSV/TSV matrix once with Sep, parsing numbers from spans with csFastFloat straight
/// into feature-major columns, in either orientation.
/// </summary>
/// <remarks>
/// Samples in rows: the columns are sized from an upper bound on the row count (a count of line
/// feeds) and trimmed at the end, so the file is never held as text and the matrix is never
/// transposed. Features in rows: each row becomes one column directly.
/// </remarks>
internal static class DelimitedMatrixReader
{
    private const int CancellationCheckRows = 64;

    public static RawMatrix Read(string path, PanelLoadOptions options, CancellationToken ct)
    {
        char delimiter = DelimiterDetector.Detect(path);
        using var text = DelimiterDetector.OpenText(path);
        using var reader = Sep.New(delimiter)
            .Reader(o => o with { HasHeader = false, Unescape = true, DisableColCountCheck = true })
            .From(text);
        var source = new MatrixSource(path, MatrixFileFormat.DelimitedText, delimiter, options.Layout);
        return options.Layout == PanelLayout.SamplesInRows
            ? ReadSamplesInRows(reader, source, options, ct)
            : ReadFeaturesInRows(reader, source, options, ct);
    }

    // Optimised at first call: a CLI loads once, so tiered compilation would run most of this
    // loop as unoptimised code before on-stack replacement catches up.
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static RawMatrix ReadSamplesInRows(SepReader reader, MatrixSource source, PanelLoadOptions options,
        CancellationToken ct)
    {
        string path = source.Path;
        string[] header = ReadHeader(reader, path);
        var roles = SampleColumnRoles.Resolve(header, options, path, isTableRow: false);
        var attributeNames = options.SampleAttributeNames();
        int[] featureColumns = roles.FeatureColumns;
        var columns = new FeatureColumns(featureColumns.Length, Math.Max(1, LineCounter.UpperBoundOfLines(path) - 1));
        var attributes = new List<string>[roles.AttributeColumns.Length];
        for (int a = 0; a < attributes.Length; a++) attributes[a] = [];
        var sampleIds = new List<string>();
        var sampleLines = new List<long>();

        int sample = 0;
        foreach (var row in reader)
        {
            if (IsBlank(row)) continue;
            long line = row.LineNumberFrom;
            CheckFieldCount(row, header.Length, path, line);
            if ((sample & (CancellationCheckRows - 1)) == 0) ct.ThrowIfCancellationRequested();
            if (sample == columns.SampleCapacity) columns.Grow();

            string id = row[roles.IdColumn].Span.Trim().ToString();
            NameRules.Check(id, "sample id", path, line, header[roles.IdColumn]);
            if (attributeNames.Contains(id))
                throw PanelInputException.At(path, line, header[roles.IdColumn],
                    $"the row label '{Display.Name(id)}' is a sample attribute name, so the file looks like features in rows.",
                    "Load it with the layout FeaturesInRows.");
            for (int a = 0; a < attributes.Length; a++)
                attributes[a].Add(row[roles.AttributeColumns[a]].Span.Trim().ToString());

            // Invariant: features 0..f-1 of this sample are stored; the row's cells are only spans.
            for (int f = 0; f < featureColumns.Length; f++)
            {
                var cell = row[featureColumns[f]].Span;
                var kind = CellText.Classify(cell, out float value);
                if (!columns.Store(f, sample, kind, value))
                    throw CellErrors.NotAMeasurement(path, line, roles.FeatureNames[f], roles.FeatureNames[f], cell, kind);
            }
            sampleIds.Add(id);
            sampleLines.Add(line);
            sample++;
        }
        if (sample == 0) throw HeaderOnly(path);
        columns.Trim(sample);

        var annotations = new Dictionary<string, string[]>(StringComparer.Ordinal);
        var otherColumns = new List<string> { header[roles.IdColumn] };
        for (int a = 0; a < attributes.Length; a++)
        {
            annotations[header[roles.AttributeColumns[a]]] = attributes[a].ToArray();
            otherColumns.Add(header[roles.AttributeColumns[a]]);
        }
        NameRules.CheckUnique(sampleIds, "sample id", path,
            "Make sample ids unique (technical replicates need their own ids; name their subject in a subject column).");
        return new RawMatrix(source, columns.ToMatrix(roles.FeatureNames, sampleIds), annotations,
            sampleLines.ToArray(), otherColumns);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static RawMatrix ReadFeaturesInRows(SepReader reader, MatrixSource source, PanelLoadOptions options,
        CancellationToken ct)
    {
        string path = source.Path;
        string[] header = ReadHeader(reader, path);
        if (header.Length < 2)
            throw PanelInputException.At(path, 1, null, "has a single column, so there are no sample columns.",
                "Check the delimiter, or load the file with the layout SamplesInRows.");
        var sampleIds = header[1..];
        for (int s = 0; s < sampleIds.Length; s++)
            NameRules.Check(sampleIds[s], "sample id", path, 1, FormattableString.Invariant($"#{s + 2}"));
        NameRules.CheckUnique(sampleIds, "sample id", path,
            "Make sample ids in the header unique (technical replicates need their own ids).");

        var attributeNames = options.SampleAttributeNames();
        var columns = new FeatureColumns(0, sampleIds.Length);
        var featureNames = new List<string>();
        var annotations = new Dictionary<string, string[]>(StringComparer.Ordinal);
        int rowCount = 0;
        foreach (var row in reader)
        {
            if (IsBlank(row)) continue;
            long line = row.LineNumberFrom;
            CheckFieldCount(row, header.Length, path, line);
            if ((rowCount++ & (CancellationCheckRows - 1)) == 0) ct.ThrowIfCancellationRequested();
            string label = row[0].Span.Trim().ToString();
            NameRules.Check(label, "feature name", path, line, header[0]);
            if (attributeNames.Contains(label))
            {
                var values = new string[sampleIds.Length];
                for (int s = 0; s < values.Length; s++) values[s] = row[s + 1].Span.Trim().ToString();
                if (!annotations.TryAdd(label, values))
                    throw PanelInputException.At(path, line, header[0],
                        $"the sample attribute row '{Display.Name(label)}' occurs twice.", "Keep one row per sample attribute.");
                continue;
            }
            int feature = columns.AppendFeature();
            featureNames.Add(label);
            for (int s = 0; s < sampleIds.Length; s++)
            {
                var cell = row[s + 1].Span;
                var kind = CellText.Classify(cell, out float value);
                if (!columns.Store(feature, s, kind, value))
                    throw CellErrors.NotAMeasurement(path, line, sampleIds[s], label, cell, kind);
            }
        }
        if (rowCount == 0) throw HeaderOnly(path);
        if (featureNames.Count == 0)
            throw PanelInputException.At(path, null, null, "has only sample attribute rows and no feature rows.",
                "Add the measurement rows, or check the layout.");
        NameRules.CheckUnique(featureNames, "feature name", path,
            "Make feature names unique (for example add the assay or isoform to the name) and load again.");
        return new RawMatrix(source, columns.ToMatrix(featureNames, sampleIds), annotations,
            new long[sampleIds.Length], [header[0]]);
    }

    private static string[] ReadHeader(SepReader reader, string path)
    {
        // Not foreach: leaving a foreach early would dispose the reader before the data rows.
        while (reader.MoveNext())
        {
            var row = reader.Current;
            if (IsBlank(row)) continue;
            var header = new string[row.ColCount];
            for (int c = 0; c < header.Length; c++) header[c] = row[c].Span.Trim().ToString();
            return header;
        }
        throw PanelInputException.At(path, null, null, "holds no text rows (it is blank).",
            "Export the matrix again; a matrix file needs a header row and at least one data row.");
    }

    private static PanelInputException HeaderOnly(string path) =>
        PanelInputException.At(path, null, null, "has a header row but no data rows.",
            "Export the matrix again with its data; check that the export did not stop early.");

    private static bool IsBlank(SepReader.Row row) => row.ColCount == 1 && row[0].Span.Trim().IsEmpty;

    private static void CheckFieldCount(SepReader.Row row, int expected, string path, long line)
    {
        if (row.ColCount != expected)
            throw PanelInputException.At(path, line, null,
                FormattableString.Invariant($"the row has {row.ColCount} fields but the header has {expected}."),
                "Fix the row (a stray delimiter, or an unquoted text field containing one); every row needs one field per header column.");
    }
}
