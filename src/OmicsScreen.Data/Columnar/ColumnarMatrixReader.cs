using OmicsScreen.Data.Assembly;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// Assembles a matrix from a Parquet or Arrow table in either orientation: samples in rows (one
/// column per feature, read straight into its feature column) or features in rows (one column
/// per sample, scattered into the feature columns).
/// </summary>
internal static class ColumnarMatrixReader
{
    public static RawMatrix Read(IColumnarTable table, PanelLoadOptions options, CancellationToken ct)
    {
        if (table.ColumnNames.Count == 0)
            throw PanelInputException.At(table.Path, null, null, "has no columns.",
                "Write the panel again with an id column and the measurement columns.");
        if (table.RowCount == 0)
            throw PanelInputException.At(table.Path, null, null, "has columns but no rows.",
                "Write the panel again with its data; check that the export did not stop early.");
        var source = new MatrixSource(table.Path, table.Format, null, options.Layout);
        return options.Layout == PanelLayout.SamplesInRows
            ? ReadSamplesInRows(table, source, options, ct)
            : ReadFeaturesInRows(table, source, options, ct);
    }

    private static RawMatrix ReadSamplesInRows(IColumnarTable table, MatrixSource source, PanelLoadOptions options,
        CancellationToken ct)
    {
        string path = table.Path;
        var header = table.ColumnNames;
        var roles = SampleColumnRoles.Resolve(header, options, path, isTableRow: true);
        var attributeNames = options.SampleAttributeNames();
        var sampleIds = TrimmedTexts(table.ReadText(roles.IdColumn));
        for (int s = 0; s < sampleIds.Length; s++)
        {
            NameRules.Check(sampleIds[s], "sample id", path, s + 1, header[roles.IdColumn], isTableRow: true);
            if (attributeNames.Contains(sampleIds[s]))
                throw PanelInputException.At(path, s + 1, header[roles.IdColumn],
                    $"the row label '{Display.Name(sampleIds[s])}' is a sample attribute name, so the table looks like features in rows.",
                    "Load it with --features-in-rows.", isTableRow: true);
        }
        NameRules.CheckUnique(sampleIds, "sample id", path,
            "Make sample ids unique (technical replicates need their own ids; name their subject in a subject column).");

        var annotations = new Dictionary<string, string[]>(StringComparer.Ordinal);
        var otherColumns = new List<string> { header[roles.IdColumn] };
        foreach (int column in roles.AttributeColumns)
        {
            annotations[header[column]] = TrimmedTexts(table.ReadText(column));
            otherColumns.Add(header[column]);
        }

        int sampleCount = table.RowCount;
        var columns = new FeatureColumns(roles.FeatureColumns.Length, sampleCount);
        var states = new CellState[sampleCount];
        for (int f = 0; f < roles.FeatureColumns.Length; f++)
        {
            ct.ThrowIfCancellationRequested();
            string name = roles.FeatureNames[f];
            if (!table.TryReadCells(roles.FeatureColumns[f], columns.Values(f), states, default, out var failure))
                throw CellErrors.NotAMeasurement(path, failure.Row + 1, name, name, failure.Text, failure.Kind, isTableRow: true,
                    textColumnFix: SampleColumnRoles.OutcomeNotInHeaderFix(header, options, name));
            columns.SetStates(f, states);
        }
        var lines = new long[sampleCount];
        for (int s = 0; s < lines.Length; s++) lines[s] = s + 1;
        return new RawMatrix(source, columns.ToMatrix(roles.FeatureNames, sampleIds, limits: options.FeatureLimits), annotations, lines, otherColumns);
    }

    private static RawMatrix ReadFeaturesInRows(IColumnarTable table, MatrixSource source, PanelLoadOptions options,
        CancellationToken ct)
    {
        string path = table.Path;
        var header = table.ColumnNames;
        if (header.Count < 2)
            throw PanelInputException.At(path, null, null, "has a single column, so there are no sample columns.",
                "Load the table without --features-in-rows, or add one column per sample.");
        var sampleIds = new string[header.Count - 1];
        for (int s = 0; s < sampleIds.Length; s++)
        {
            sampleIds[s] = header[s + 1];
            NameRules.Check(sampleIds[s], "sample id", path, null, FormattableString.Invariant($"#{s + 2}"));
        }
        NameRules.CheckUnique(sampleIds, "sample id", path,
            "Make the sample column names unique (technical replicates need their own ids).");

        var attributeNames = options.SampleAttributeNames();
        var labels = TrimmedTexts(table.ReadText(0));
        var skipRows = new bool[labels.Length];
        var featureOfRow = new int[labels.Length];
        var featureNames = new List<string>();
        var attributeRows = new List<int>();
        for (int r = 0; r < labels.Length; r++)
        {
            NameRules.Check(labels[r], "feature name", path, r + 1, header[0], isTableRow: true);
            if (attributeNames.Contains(labels[r]))
            {
                skipRows[r] = true;
                featureOfRow[r] = -1;
                attributeRows.Add(r);
                continue;
            }
            featureOfRow[r] = featureNames.Count;
            featureNames.Add(labels[r]);
        }
        if (featureNames.Count == 0)
            throw PanelInputException.At(path, null, null, "has only sample attribute rows and no feature rows.",
                "Add the measurement rows, or check the layout.");
        NameRules.CheckUnique(featureNames, "feature name", path,
            "Make feature names unique (for example add the assay or isoform to the name) and load again.");

        var columns = new FeatureColumns(featureNames.Count, sampleIds.Length);
        var values = new float[labels.Length];
        var states = new CellState[labels.Length];
        for (int s = 0; s < sampleIds.Length; s++)
        {
            ct.ThrowIfCancellationRequested();
            if (!table.TryReadCells(s + 1, values, states, skipRows, out var failure))
                throw CellErrors.NotAMeasurement(path, failure.Row + 1, sampleIds[s], labels[failure.Row], failure.Text,
                    failure.Kind, isTableRow: true);
            // Scatter: row r of this sample's column is cell (featureOfRow[r], s).
            for (int r = 0; r < labels.Length; r++)
            {
                int feature = featureOfRow[r];
                if (feature < 0) continue;
                var kind = states[r] switch
                {
                    CellState.Missing => CellKind.Missing,
                    CellState.BelowDetection => CellKind.BelowDetection,
                    _ => CellKind.Measured,
                };
                columns.Store(feature, s, kind, values[r]);
            }
        }

        var annotations = new Dictionary<string, string[]>(StringComparer.Ordinal);
        foreach (int r in attributeRows)
        {
            if (annotations.ContainsKey(labels[r]))
                throw PanelInputException.At(path, r + 1, header[0],
                    $"the sample attribute row '{Display.Name(labels[r])}' occurs twice.", "Keep one row per sample attribute.",
                    isTableRow: true);
            annotations[labels[r]] = new string[sampleIds.Length];
        }
        if (attributeRows.Count > 0)
        {
            for (int s = 0; s < sampleIds.Length; s++)
            {
                var texts = table.ReadText(s + 1);
                foreach (int r in attributeRows) annotations[labels[r]][s] = (texts[r] ?? "").Trim();
            }
        }
        return new RawMatrix(source, columns.ToMatrix(featureNames, sampleIds, limits: options.FeatureLimits), annotations,
            new long[sampleIds.Length], [header[0]]);
    }

    private static string[] TrimmedTexts(string?[] texts)
    {
        var trimmed = new string[texts.Length];
        for (int i = 0; i < texts.Length; i++) trimmed[i] = (texts[i] ?? "").Trim();
        return trimmed;
    }
}
