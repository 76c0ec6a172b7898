using System.Runtime.CompilerServices;
using nietras.SeparatedValues;
using OmicsScreen.Data.Assembly;

namespace OmicsScreen.Data.Text;

/// <summary>
/// Streams a CSV/TSV matrix once with Sep, parsing rows on all cores and numbers from spans with
/// csFastFloat straight into feature-major columns, in either orientation.
/// </summary>
/// <remarks>
/// The columns are sized from an upper bound on the row count (a count of line breaks); each
/// non-blank row claims the next free slot with an atomic counter, so workers never share a cell
/// and the file is never held as text. Results come back in file order (Sep's ordered parallel
/// enumeration); the reading thread validates them in that order, remembers each row's slot, and
/// finally gathers the slots into file order, a column at a time.
/// </remarks>
internal static class DelimitedMatrixReader
{
    private const int CancellationCheckRows = 64;

    public static RawMatrix Read(string path, PanelLoadOptions options, CancellationToken ct)
    {
        try
        {
            return ReadRows(path, options, ct);
        }
        catch (AggregateException e) when (e.InnerExceptions.Count == 1 && e.InnerExceptions[0] is PanelInputException inner)
        {
            // A damaged gzip file is found while Sep reads ahead for its parsing workers.
            System.Runtime.ExceptionServices.ExceptionDispatchInfo.Throw(inner);
            throw;
        }
        catch (Exception e) when (LongRows.IsRowTooLong(e))
        {
            // Sep holds a row in a buffer of at most 16 Mi characters; a longer one is read again row by row.
            return options.Layout == PanelLayout.SamplesInRows
                ? ReadLongSamplesInRows(path, options, ct)
                : ReadLongFeaturesInRows(path, options, ct);
        }
    }

    private static RawMatrix ReadRows(string path, PanelLoadOptions options, CancellationToken ct)
    {
        char delimiter = DelimiterDetector.Detect(path);
        using var text = DelimiterDetector.OpenText(path);
        using var reader = Open(text, delimiter);
        var source = new MatrixSource(path, MatrixFileFormat.DelimitedText, delimiter, options.Layout) { Gzip = TextInput.IsGzip(path) };
        var header = ReadHeader(reader, path, out int commentLines);
        source = source with { CommentLineCount = commentLines };
        int rowBound = Math.Max(1, LineCounter.UpperBoundOfLines(path) - 1);
        var slots = new SlotCounter();
        return options.Layout == PanelLayout.SamplesInRows
            ? ReadSamplesInRows(reader, header, slots, rowBound, source, options, ct)
            : ReadFeaturesInRows(reader, header, slots, rowBound, source, options, ct);
    }

    /// <summary>The header's cells, trimmed, without reading any data row.</summary>
    public static string[] ReadHeaderCells(string path)
    {
        try
        {
            using var text = DelimiterDetector.OpenText(path);
            using var reader = Open(text, DelimiterDetector.Detect(path));
            return ReadHeader(reader, path, out _);
        }
        catch (Exception e) when (LongRows.IsRowTooLong(e))
        {
            using var text = DelimiterDetector.OpenText(path);
            var reader = new TextRowReader(text, DelimiterDetector.Detect(path));
            return ReadLongHeader(reader, new TextRow(), path, out _);
        }
    }

    private static SepReader Open(TextReader text, char delimiter) =>
        Sep.New(delimiter)
            .Reader(o => o with { HasHeader = false, Unescape = true, DisableColCountCheck = true })
            .From(text);

    private static RawMatrix ReadSamplesInRows(SepReader reader, string[] header, SlotCounter slots, int rowBound,
        MatrixSource source, PanelLoadOptions options, CancellationToken ct)
    {
        string path = source.Path;
        var roles = SampleColumnRoles.Resolve(header, options, path, isTableRow: false);
        var attributeNames = options.SampleAttributeNames();
        var columns = new FeatureColumns(roles.FeatureColumns.Length, rowBound);
        var rows = reader.ParallelEnumerate(row => ParseSampleRow(row, header.Length, slots, roles, attributeNames, columns),
            Environment.ProcessorCount);
        return CollectSamples(rows, header, roles, attributeNames, columns, source, options, ct);
    }

    /// <summary>
    /// Samples in rows when a row is longer than Sep's buffer: the same checks and storage, one
    /// row at a time on this thread (a file of such rows has few of them, each of millions of cells).
    /// </summary>
    internal static RawMatrix ReadLongSamplesInRows(string path, PanelLoadOptions options, CancellationToken ct)
    {
        char delimiter = DelimiterDetector.Detect(path);
        using var text = DelimiterDetector.OpenText(path);
        var reader = new TextRowReader(text, delimiter);
        var row = new TextRow();
        var header = ReadLongHeader(reader, row, path, out int commentLines);
        var source = new MatrixSource(path, MatrixFileFormat.DelimitedText, delimiter, options.Layout) { Gzip = TextInput.IsGzip(path), CommentLineCount = commentLines };
        int rowBound = Math.Max(1, LineCounter.UpperBoundOfLines(path) - 1);
        var slots = new SlotCounter();
        var roles = SampleColumnRoles.Resolve(header, options, path, isTableRow: false);
        var attributeNames = options.SampleAttributeNames();
        var columns = new FeatureColumns(roles.FeatureColumns.Length, rowBound);
        IEnumerable<ParsedRow> Rows()
        {
            while (reader.Next(row)) yield return ParseSampleRow(row, header.Length, slots, roles, attributeNames, columns);
        }
        return CollectSamples(Rows(), header, roles, attributeNames, columns, source, options, ct);
    }

    /// <summary>Checks the parsed rows in file order, then gathers the samples' slots into the matrix.</summary>
    private static RawMatrix CollectSamples(IEnumerable<ParsedRow> rows, string[] header, SampleColumnRoles roles,
        HashSet<string> attributeNames, FeatureColumns columns, MatrixSource source, PanelLoadOptions options, CancellationToken ct)
    {
        string path = source.Path;
        var attributes = new List<string>[roles.AttributeColumns.Length];
        for (int a = 0; a < attributes.Length; a++) attributes[a] = [];
        var sampleIds = new List<string>();
        var sampleLines = new List<long>();
        var sampleSlots = new List<int>();
        foreach (var row in rows)
        {
            if (row.IsBlank) continue;
            if ((sampleIds.Count & (CancellationCheckRows - 1)) == 0) ct.ThrowIfCancellationRequested();
            CheckRow(row, header.Length, path);
            NameRules.Check(row.Label, "sample id", path, row.Line, header[roles.IdColumn]);
            if (attributeNames.Contains(row.Label))
                throw PanelInputException.At(path, row.Line, header[roles.IdColumn],
                    $"the row label '{Display.Name(row.Label)}' is a sample attribute name, so the file looks like features in rows.",
                    "Load it with --features-in-rows.");
            if (row.FailedIndex >= 0)
            {
                string feature = roles.FeatureNames[row.FailedIndex];
                throw CellErrors.NotAMeasurement(path, row.Line, feature, feature, row.FailedText, row.FailedKind,
                    textColumnFix: SampleColumnRoles.OutcomeNotInHeaderFix(header, options, feature));
            }
            for (int a = 0; a < attributes.Length; a++) attributes[a].Add(row.Texts![a]);
            sampleIds.Add(row.Label);
            sampleLines.Add(row.Line);
            sampleSlots.Add(row.Slot);
        }
        if (sampleIds.Count == 0) throw HeaderOnly(path);
        NameRules.CheckUnique(sampleIds, "sample id", path,
            "Make sample ids unique (technical replicates need their own ids; name their subject in a subject column).");

        var annotations = new Dictionary<string, string[]>(StringComparer.Ordinal);
        var otherColumns = new List<string> { header[roles.IdColumn] };
        for (int a = 0; a < attributes.Length; a++)
        {
            annotations[header[roles.AttributeColumns[a]]] = attributes[a].ToArray();
            otherColumns.Add(header[roles.AttributeColumns[a]]);
        }
        var matrix = columns.ToMatrix(roles.FeatureNames, sampleIds, sampleSlots: sampleSlots.ToArray(), limits: options.FeatureLimits);
        return new RawMatrix(source, matrix, annotations, sampleLines.ToArray(), otherColumns);
    }

    /// <summary>Runs on a worker: stores one sample's cells in its slot, stopping at the first bad cell.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static ParsedRow ParseSampleRow(SepReader.Row row, int fieldCount, SlotCounter slots, SampleColumnRoles roles,
        HashSet<string> attributeNames, FeatureColumns columns)
    {
        var parsed = Start(row, slots, columns.SampleCapacity);
        if (!parsed.CanHoldCells(fieldCount)) return parsed;
        int slot = parsed.Slot;
        parsed.Label = row[roles.IdColumn].Span.Trim().ToString();
        var texts = new string[roles.AttributeColumns.Length];
        for (int a = 0; a < texts.Length; a++) texts[a] = row[roles.AttributeColumns[a]].Span.Trim().ToString();
        parsed.Texts = texts;
        if (attributeNames.Contains(parsed.Label)) return parsed;

        int[] featureColumns = roles.FeatureColumns;
        // Invariant: features 0..f-1 of this sample are stored; the row's cells are only spans.
        for (int f = 0; f < featureColumns.Length; f++)
        {
            var cell = row[featureColumns[f]].Span;
            var kind = CellText.Classify(cell, out float value);
            if (!columns.Store(f, slot, kind, value))
            {
                parsed.Fail(f, cell, kind);
                break;
            }
        }
        return parsed;
    }

    /// <summary>
    /// <see cref="ParseSampleRow(SepReader.Row, int, SlotCounter, SampleColumnRoles, HashSet{string}, FeatureColumns)"/>
    /// for a row of <see cref="TextRowReader"/>: the same steps, cell for cell.
    /// </summary>
    private static ParsedRow ParseSampleRow(TextRow row, int fieldCount, SlotCounter slots, SampleColumnRoles roles,
        HashSet<string> attributeNames, FeatureColumns columns)
    {
        if (row.IsBlank) return new ParsedRow { IsBlank = true };
        int slot = slots.Next();
        var parsed = new ParsedRow
        {
            Line = row.FirstLine, FieldCount = row.FieldCount, Slot = slot, BeyondCapacity = slot >= columns.SampleCapacity,
            IsComment = DelimiterDetector.IsComment(row[0]),
        };
        if (!parsed.CanHoldCells(fieldCount)) return parsed;
        parsed.Label = row[roles.IdColumn].Trim().ToString();
        var texts = new string[roles.AttributeColumns.Length];
        for (int a = 0; a < texts.Length; a++) texts[a] = row[roles.AttributeColumns[a]].Trim().ToString();
        parsed.Texts = texts;
        if (attributeNames.Contains(parsed.Label)) return parsed;
        int[] featureColumns = roles.FeatureColumns;
        for (int f = 0; f < featureColumns.Length; f++)
        {
            var cell = row[featureColumns[f]];
            var kind = CellText.Classify(cell, out float value);
            if (!columns.Store(f, slot, kind, value))
            {
                parsed.Fail(f, cell, kind);
                break;
            }
        }
        return parsed;
    }

    private static string[] ReadLongHeader(TextRowReader reader, TextRow row, string path, out int commentLines)
    {
        commentLines = 0;
        while (reader.Next(row))
        {
            if (row.IsBlank) continue;
            if (DelimiterDetector.IsCommentAboveHeader(row[0]))
            {
                commentLines++;
                continue;
            }
            var header = new string[row.FieldCount];
            for (int c = 0; c < header.Length; c++) header[c] = row[c].Trim().ToString();
            return header;
        }
        throw PanelInputException.At(path, null, null, "holds no text rows (it is blank).",
            "Export the matrix again; a matrix file needs a header row and at least one data row.");
    }

    private static RawMatrix ReadFeaturesInRows(SepReader reader, string[] header, SlotCounter slots, int rowBound,
        MatrixSource source, PanelLoadOptions options, CancellationToken ct)
    {
        var attributeNames = options.SampleAttributeNames();
        var roles = FeaturesInRowsRoles(header, source, options, attributeNames);
        var columns = new FeatureColumns(rowBound, roles.SampleIds.Length);
        var rows = reader.ParallelEnumerate(row => ParseFeatureRow(row, header.Length, slots, attributeNames, roles, columns),
            Environment.ProcessorCount);
        return CollectFeatures(rows, header, roles, columns, source, options, ct);
    }

    /// <summary>
    /// Features in rows when a row is longer than Sep's buffer (a header or a feature over about a
    /// million samples, or very long numbers): the same checks and storage, one row at a time on this thread.
    /// </summary>
    internal static RawMatrix ReadLongFeaturesInRows(string path, PanelLoadOptions options, CancellationToken ct)
    {
        char delimiter = DelimiterDetector.Detect(path);
        using var text = DelimiterDetector.OpenText(path);
        var reader = new TextRowReader(text, delimiter);
        var row = new TextRow();
        var header = ReadLongHeader(reader, row, path, out int commentLines);
        var source = new MatrixSource(path, MatrixFileFormat.DelimitedText, delimiter, options.Layout) { Gzip = TextInput.IsGzip(path), CommentLineCount = commentLines };
        var attributeNames = options.SampleAttributeNames();
        var roles = FeaturesInRowsRoles(header, source, options, attributeNames);
        int rowBound = Math.Max(1, LineCounter.UpperBoundOfLines(path) - 1);
        var slots = new SlotCounter();
        var columns = new FeatureColumns(rowBound, roles.SampleIds.Length);
        IEnumerable<ParsedRow> Rows()
        {
            while (reader.Next(row)) yield return ParseFeatureRow(row, header.Length, slots, attributeNames, roles, columns);
        }
        return CollectFeatures(Rows(), header, roles, columns, source, options, ct);
    }

    /// <summary>The header's describing columns and sample ids (every other column), checked.</summary>
    private static FeatureRowRoles FeaturesInRowsRoles(string[] header, MatrixSource source, PanelLoadOptions options, HashSet<string> attributeNames)
    {
        string path = source.Path;
        if (header.Length < 2)
            throw PanelInputException.At(path, 1, null, "has a single column, so there are no sample columns.",
                "Check the delimiter, or load the file without --features-in-rows.");
        var roles = FeatureRowRoles.Resolve(header, options, path,
            () => LeadingTextColumns.Count(path, source.Delimiter!.Value, header.Length, attributeNames, FeatureRowRoles.ScannedRows));
        var sampleIds = roles.SampleIds;
        for (int s = 0; s < sampleIds.Length; s++)
            NameRules.Check(sampleIds[s], "sample id", path, 1, FormattableString.Invariant($"#{roles.SampleColumns[s] + 1}"));
        NameRules.CheckUnique(sampleIds, "sample id", path,
            "Make sample ids in the header unique (technical replicates need their own ids).");
        return roles;
    }

    /// <summary>Checks the parsed feature rows in file order, then gathers the features' slots into the matrix.</summary>
    private static RawMatrix CollectFeatures(IEnumerable<ParsedRow> rows, string[] header, FeatureRowRoles roles,
        FeatureColumns columns, MatrixSource source, PanelLoadOptions options, CancellationToken ct)
    {
        string path = source.Path;
        var sampleIds = roles.SampleIds;
        var descriptors = new List<string[]>();
        var featureNames = new List<string>();
        var featureSlots = new List<int>();
        var annotations = new Dictionary<string, string[]>(StringComparer.Ordinal);
        int rowCount = 0;
        string idName = header[roles.IdColumn];
        foreach (var row in rows)
        {
            if (row.IsBlank) continue;
            if ((rowCount++ & (CancellationCheckRows - 1)) == 0) ct.ThrowIfCancellationRequested();
            CheckRow(row, header.Length, path);
            NameRules.Check(row.Label, "feature name", path, row.Line, idName);
            if (row.Texts is { } values)
            {
                if (!annotations.TryAdd(row.Label, values))
                    throw PanelInputException.At(path, row.Line, idName,
                        $"the sample attribute row '{Display.Name(row.Label)}' occurs twice.", "Keep one row per sample attribute.");
                continue;
            }
            if (row.FailedIndex >= 0)
                throw CellErrors.NotAMeasurement(path, row.Line, sampleIds[row.FailedIndex], row.Label, row.FailedText,
                    row.FailedKind, textColumnFix: DescriptorFix(roles), textColumnIsSample: true);
            featureNames.Add(row.Label);
            featureSlots.Add(row.Slot);
            descriptors.Add(row.Descriptors!);
        }
        if (rowCount == 0) throw HeaderOnly(path);
        if (featureNames.Count == 0)
            throw PanelInputException.At(path, null, null, "has only sample attribute rows and no feature rows.",
                "Add the measurement rows, or check the layout.");
        NameRules.CheckUnique(featureNames, "feature name", path,
            "Make feature names unique (for example add the assay or isoform to the name) and load again.");
        var matrix = columns.ToMatrix(featureNames, sampleIds, featureSlots: featureSlots.ToArray(), limits: options.FeatureLimits);
        var featureAnnotations = new List<(string Name, string[] Values)>(roles.AnnotationColumns.Length);
        for (int a = 0; a < roles.AnnotationColumns.Length; a++)
        {
            var values = new string[descriptors.Count];
            for (int f = 0; f < values.Length; f++) values[f] = descriptors[f][a];
            featureAnnotations.Add((roles.AnnotationNames[a], values));
        }
        return new RawMatrix(source, matrix, annotations, new long[sampleIds.Length], [idName])
        {
            FeatureIdColumn = idName,
            FeatureAnnotations = featureAnnotations,
            FeatureColumnsDetected = roles.Detected,
        };
    }

    /// <summary>For a text cell in a sample column when the describing columns were guessed: the option that names them.</summary>
    private static string? DescriptorFix(FeatureRowRoles roles)
    {
        if (!roles.Detected) return null;
        return "If this column describes features (a symbol, a name, a description) rather than measuring a sample, name every describing column with --feature-columns (the first names the feature), for example --feature-columns "
            + "ID --feature-columns SYMBOL; by default only leading columns that hold mostly text are taken.";
    }

    /// <summary>Runs on a worker: stores one feature's cells in its column slot, or keeps an attribute row as text.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static ParsedRow ParseFeatureRow(SepReader.Row row, int fieldCount, SlotCounter slots, HashSet<string> attributeNames,
        FeatureRowRoles roles, FeatureColumns columns)
    {
        var parsed = Start(row, slots, columns.FeatureCount);
        if (!parsed.CanHoldCells(fieldCount)) return parsed;
        int slot = parsed.Slot;
        parsed.Label = row[roles.IdColumn].Span.Trim().ToString();
        int[] sampleColumns = roles.SampleColumns;
        int sampleCount = sampleColumns.Length;
        if (attributeNames.Contains(parsed.Label))
        {
            var texts = new string[sampleCount];
            for (int s = 0; s < texts.Length; s++) texts[s] = row[sampleColumns[s]].Span.Trim().ToString();
            parsed.Texts = texts;
            return parsed;
        }
        var descriptors = new string[roles.AnnotationColumns.Length];
        for (int a = 0; a < descriptors.Length; a++) descriptors[a] = row[roles.AnnotationColumns[a]].Span.Trim().ToString();
        parsed.Descriptors = descriptors;
        for (int s = 0; s < sampleCount; s++)
        {
            var cell = row[sampleColumns[s]].Span;
            var kind = CellText.Classify(cell, out float value);
            if (!columns.Store(slot, s, kind, value))
            {
                parsed.Fail(s, cell, kind);
                break;
            }
        }
        return parsed;
    }

    /// <summary>
    /// <see cref="ParseFeatureRow(SepReader.Row, int, SlotCounter, HashSet{string}, FeatureRowRoles, FeatureColumns)"/>
    /// for a row of <see cref="TextRowReader"/>: the same steps, cell for cell.
    /// </summary>
    private static ParsedRow ParseFeatureRow(TextRow row, int fieldCount, SlotCounter slots, HashSet<string> attributeNames,
        FeatureRowRoles roles, FeatureColumns columns)
    {
        if (row.IsBlank) return new ParsedRow { IsBlank = true };
        int slot = slots.Next();
        var parsed = new ParsedRow
        {
            Line = row.FirstLine, FieldCount = row.FieldCount, Slot = slot, BeyondCapacity = slot >= columns.FeatureCount,
            IsComment = DelimiterDetector.IsComment(row[0]),
        };
        if (!parsed.CanHoldCells(fieldCount)) return parsed;
        parsed.Label = row[roles.IdColumn].Trim().ToString();
        int[] sampleColumns = roles.SampleColumns;
        int sampleCount = sampleColumns.Length;
        if (attributeNames.Contains(parsed.Label))
        {
            var texts = new string[sampleCount];
            for (int s = 0; s < texts.Length; s++) texts[s] = row[sampleColumns[s]].Trim().ToString();
            parsed.Texts = texts;
            return parsed;
        }
        var descriptors = new string[roles.AnnotationColumns.Length];
        for (int a = 0; a < descriptors.Length; a++) descriptors[a] = row[roles.AnnotationColumns[a]].Trim().ToString();
        parsed.Descriptors = descriptors;
        for (int s = 0; s < sampleCount; s++)
        {
            var cell = row[sampleColumns[s]];
            var kind = CellText.Classify(cell, out float value);
            if (!columns.Store(slot, s, kind, value))
            {
                parsed.Fail(s, cell, kind);
                break;
            }
        }
        return parsed;
    }

    /// <summary>Claims the next slot for a non-blank row and records where the row is.</summary>
    private static ParsedRow Start(SepReader.Row row, SlotCounter slots, int slotCapacity)
    {
        if (IsBlank(row)) return new ParsedRow { IsBlank = true };
        int slot = slots.Next();
        return new ParsedRow
        {
            Line = FirstLine(row), FieldCount = row.ColCount, Slot = slot, BeyondCapacity = slot >= slotCapacity,
            IsComment = DelimiterDetector.IsComment(row[0].Span),
        };
    }

    /// <summary>
    /// The 1-based line a row starts on. Under parallel enumeration Sep 0.17 reports a wrong
    /// start line for the first row of each batch, but the end line is always right; a quoted
    /// field may hold line breaks, which are counted back.
    /// </summary>
    private static long FirstLine(SepReader.Row row) =>
        row.LineNumberToExcl - 1 - row.Span.Count('\n');

    internal static string[] ReadHeader(SepReader reader, string path, out int commentLines)
    {
        commentLines = 0;
        // Not foreach: leaving a foreach early would dispose the reader before the data rows.
        while (reader.MoveNext())
        {
            var row = reader.Current;
            if (IsBlank(row)) continue;
            if (DelimiterDetector.IsCommentAboveHeader(row[0].Span))
            {
                commentLines++;
                continue;
            }
            var header = new string[row.ColCount];
            for (int c = 0; c < header.Length; c++) header[c] = row[c].Span.Trim().ToString();
            return header;
        }
        throw PanelInputException.At(path, null, null, "holds no text rows (it is blank).",
            "Export the matrix again; a matrix file needs a header row and at least one data row.");
    }

    /// <summary>Hands out row slots to parsing workers, each exactly once.</summary>
    private sealed class SlotCounter
    {
        private int _next = -1;

        public int Next() => Interlocked.Increment(ref _next);
    }

    private static PanelInputException HeaderOnly(string path) =>
        PanelInputException.At(path, null, null, "has a header row but no data rows.",
            "Export the matrix again with its data; check that the export did not stop early.");

    private static bool IsBlank(SepReader.Row row) => row.ColCount == 1 && row[0].Span.Trim().IsEmpty;

    private static void CheckRow(ParsedRow row, int expected, string path)
    {
        if (row.IsComment) throw DelimiterDetector.CommentInsideData(path, row.Line);
        if (row.FieldCount != expected)
            throw PanelInputException.At(path, row.Line, null,
                FormattableString.Invariant($"the row has {row.FieldCount} fields but the header has {expected}."),
                "Fix the row (a stray delimiter, or an unquoted text field containing one); every row needs one field per header column.");
        if (row.BeyondCapacity)
            throw PanelInputException.At(path, row.Line, null,
                "has more rows than line breaks, which only a damaged or unusually encoded file can have.",
                "Save the file again as UTF-8 text with LF or CRLF line endings.");
    }
}
